/**
 * ROR display names of companies end in a parenthesised country ("Ohta's ISAN Co., Ltd. (Japan)"): a convention of
 * that registry, not a name form found in contracts. The stripper removes a trailing "(X)" only when X is the
 * English name of a country or territory, as ICU's Intl.DisplayNames gives it for an ISO 3166-1 alpha-2 code,
 * plus a few older English short names ICU no longer uses. Any other parenthesised text ("(Europe)", "(UK) Ltd")
 * is kept: it can tell two real entities apart.
 */
const OLDER_NAMES = [
  'Turkey',
  'Czech Republic',
  'Korea',
  'Republic of Korea',
  'Russian Federation',
  'Hong Kong',
  'Macau',
  'Macao',
  'Swaziland',
  'Cape Verde',
  'Ivory Coast',
  'Burma',
];

export function countryQualifierStripper(): (name: string) => string {
  const names = new Set(OLDER_NAMES.map((n) => n.toLowerCase()));
  const display = new Intl.DisplayNames(['en'], { type: 'region' });
  for (let a = 65; a <= 90; a++) {
    for (let b = 65; b <= 90; b++) {
      const code = String.fromCharCode(a, b);
      const name = display.of(code);
      if (name && name !== code) names.add(name.toLowerCase());
    }
  }
  return (name: string): string => {
    const trimmed = name.trimEnd();
    if (!trimmed.endsWith(')')) return name;
    const open = trimmed.lastIndexOf('(');
    if (open <= 0) return name;
    const inside = trimmed
      .slice(open + 1, -1)
      .trim()
      .toLowerCase();
    if (!names.has(inside)) return name;
    return trimmed.slice(0, open).trimEnd();
  };
}
