/** The registration and tax identifiers of an invented company of the demo scenario. */
import type { Random } from '../../../resolvers/prng.ts';
import type { Identifier } from '../../../resolvers/vocabulary.ts';
import { countryOf } from '../name-parts.ts';
import * as ids from './identifiers.ts';

/** Registration and tax identifiers usual for a company of that jurisdiction and form. */
export function companyIdentifiers(rnd: Random, jurisdiction: string, legalForm: string): Identifier[] {
  const c = countryOf(jurisdiction);
  const out: Identifier[] = [];
  switch (c) {
    case 'US':
      if (rnd.chance(0.7)) out.push({ scheme: 'us_ein', value: ids.usEin(rnd) });
      break;
    case 'GB':
      out.push({ scheme: 'gb_company', value: ids.gbCompanyNumber(rnd) });
      if (rnd.chance(0.7)) out.push({ scheme: 'vat', value: ids.gbVat(rnd) });
      break;
    case 'DE': {
      const reg = ids.deRegister(rnd, legalForm.includes('KG'));
      out.push({ scheme: 'de_register', value: `${reg.court} ${reg.type} ${reg.number}` });
      if (rnd.chance(0.7)) out.push({ scheme: 'vat', value: ids.deVat(rnd) });
      break;
    }
    case 'FR': {
      const siren = ids.frSiren(rnd);
      out.push({ scheme: 'fr_siren', value: siren });
      if (rnd.chance(0.7)) out.push({ scheme: 'vat', value: ids.frVat(siren) });
      break;
    }
    case 'NL':
      out.push({ scheme: 'nl_kvk', value: ids.nlKvk(rnd) });
      if (rnd.chance(0.6)) out.push({ scheme: 'vat', value: ids.nlVat(rnd) });
      break;
    case 'AU': {
      const acn = ids.auAcn(rnd);
      out.push({ scheme: 'au_acn', value: acn });
      if (rnd.chance(0.8)) out.push({ scheme: 'au_abn', value: ids.auAbnFromAcn(acn) });
      break;
    }
    case 'SE': {
      const org = ids.seOrg(rnd);
      out.push({ scheme: 'se_org', value: org });
      if (rnd.chance(0.6)) out.push({ scheme: 'vat', value: ids.seVat(org) });
      break;
    }
    case 'IT':
      if (rnd.chance(0.8)) out.push({ scheme: 'vat', value: ids.itVat(rnd) });
      break;
    case 'JP':
      if (rnd.chance(0.8)) out.push({ scheme: 'other', label: 'jp_corporate_number', value: ids.jpCorporateNumber(rnd) });
      break;
    default:
      break;
  }
  if (rnd.chance(0.15)) out.push({ scheme: 'lei', value: ids.lei(rnd) });
  return out;
}
