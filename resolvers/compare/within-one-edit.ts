/**
 * Whether two words are at most one edit apart: one character inserted, deleted or replaced, or two adjacent
 * characters swapped (the optimal-string-alignment distance of Damerau 1964 is ≤ 1). Damerau found that about 80 %
 * of misspellings are one such edit, which is why one edit, not a similarity cut, reads a typo in a short word.
 *
 * Linear and allocation-free (this runs for word pairs of every candidate pair); characters are UTF-16 code units,
 * like the other kernels here. Cross-checked against fast-levenshtein in the tests.
 */
export function withinOneEdit(a: string, b: string): boolean {
  if (a === b) return true;
  const la = a.length;
  const lb = b.length;
  if (la - lb > 1 || lb - la > 1) return false;
  let start = 0;
  while (start < la && start < lb && a.charCodeAt(start) === b.charCodeAt(start)) start++;
  let endA = la;
  let endB = lb;
  while (endA > start && endB > start && a.charCodeAt(endA - 1) === b.charCodeAt(endB - 1)) {
    endA--;
    endB--;
  }
  const restA = endA - start;
  const restB = endB - start;
  // What is left between the common prefix and suffix: at most one character on each side (insert, delete,
  // replace), or two characters swapped.
  if (restA <= 1 && restB <= 1) return true;
  return restA === 2 && restB === 2 && a.charCodeAt(start) === b.charCodeAt(start + 1) && a.charCodeAt(start + 1) === b.charCodeAt(start);
}
