/**
 * English renderings a jurisdiction's companies use for their own legal form, so that "Orvanel Japan Co., Ltd."
 * and "Orvanel Japan K.K." are one entity: the same name with the form translated, never a second company. Keyed
 * by country, then by the local form's family (legal-form-families.ts); values are renderings as written by
 * renderedForm ("co ltd" for "Co., Ltd."). Japanese law fixes no English name, and kabushiki kaisha write
 * "Co., Ltd.", "Corporation" or "Inc.", godo kaisha "LLC" (common practice).
 */
export const TRANSLATED_LEGAL_FORMS: Readonly<Record<string, Readonly<Record<string, readonly string[]>>>> = {
  JP: { kk: ['co ltd', 'corp', 'inc'], gk: ['llc'] },
};
