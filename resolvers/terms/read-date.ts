/**
 * Dates as contracts write them, read to ISO 8601 (yyyy-mm-dd): "3 March 2025", "3rd March 2025", "March 3, 2025",
 * "the 9th day of January, 2025", "2025-03-03" (British, US and ISO 8601 conventions; common practice). Numeric
 * day/month forms ("03/04/2025") are left out on purpose: they read differently in the US and elsewhere.
 */
const MONTHS = ['january', 'february', 'march', 'april', 'may', 'june', 'july', 'august', 'september', 'october', 'november', 'december'];

const DAY_MONTH_YEAR =
  /\b(\d{1,2})(?:st|nd|rd|th)?(?: day of)? (january|february|march|april|may|june|july|august|september|october|november|december),? (\d{4})\b/giu;
const MONTH_DAY_YEAR = /\b(january|february|march|april|may|june|july|august|september|october|november|december) (\d{1,2})(?:st|nd|rd|th)?, (\d{4})\b/giu;
const ISO = /\b(\d{4})-(\d{2})-(\d{2})\b/gu;

function iso(year: number, month: number, day: number): string | undefined {
  if (month < 1 || month > 12 || day < 1 || day > 31 || year < 1900 || year > 2200) return undefined;
  const d = new Date(Date.UTC(year, month - 1, day));
  if (d.getUTCMonth() !== month - 1) return undefined;
  return d.toISOString().slice(0, 10);
}

/** Every date written in `text`, in order of appearance, as ISO 8601. */
export function datesIn(text: string): string[] {
  const found: { at: number; date: string }[] = [];
  const add = (at: number, date: string | undefined) => {
    if (date !== undefined) found.push({ at, date });
  };
  for (const m of text.matchAll(DAY_MONTH_YEAR)) add(m.index, iso(Number(m[3]), MONTHS.indexOf((m[2] as string).toLowerCase()) + 1, Number(m[1])));
  for (const m of text.matchAll(MONTH_DAY_YEAR)) add(m.index, iso(Number(m[3]), MONTHS.indexOf((m[1] as string).toLowerCase()) + 1, Number(m[2])));
  for (const m of text.matchAll(ISO)) add(m.index, iso(Number(m[1]), Number(m[2]), Number(m[3])));
  return found.sort((a, b) => a.at - b.at).map((f) => f.date);
}

/** The first date written in `text`, as ISO 8601. */
export function readDate(text: string): string | undefined {
  return datesIn(text)[0];
}
