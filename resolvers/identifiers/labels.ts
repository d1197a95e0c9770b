/**
 * Registration numbers often arrive with their label ("KvK 12345678", "ABN 51 824 753 556", "Org.nr
 * 556677-8899"). Each scheme names the labels it accepts; anything else left after the digits is an error,
 * so a wrong scheme or a mixed-up field is reported instead of silently read as digits.
 */
import { digitsIgnoringSeparators } from './types.ts';

/** Removes the first label the value starts with (case-insensitive), then a ':' / '#' / 'no.' after it. */
export function stripLabel(value: string, labels: readonly string[]): string {
  let rest = value.trim();
  const lower = rest.toLowerCase();
  for (const label of labels) {
    if (lower.startsWith(label)) {
      rest = rest.slice(label.length).trim();
      break;
    }
  }
  for (const marker of [':', '#', 'no.', 'nr.', 'no', 'nr']) {
    if (rest.toLowerCase().startsWith(marker)) {
      rest = rest.slice(marker.length).trim();
      break;
    }
  }
  if (rest.startsWith(':')) rest = rest.slice(1).trim();
  return rest;
}

/** Digits of a value written with its label and common separators; null when something else is in it. */
export function labelledDigits(value: string, labels: readonly string[]): string | null {
  return digitsIgnoringSeparators(stripLabel(value, labels));
}
