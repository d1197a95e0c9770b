/**
 * Fellegi–Sunter weights (Fellegi & Sunter 1969). For a two-level feature with m = P(agree | match) and
 * u = P(agree | non-match): agreement weight log2(m/u), disagreement weight log2((1−m)/(1−u)).
 * With several levels (bands of similarity, a "missing" category as in ABS 3302.0.55.004) each level k
 * weighs log2(m_k/u_k); the two-level case is the special case above.
 */
export function matchWeight(m: number, u: number): number {
  return Math.log2(m / u);
}

export function nonMatchWeight(m: number, u: number): number {
  return Math.log2((1 - m) / (1 - u));
}

export function levelWeight(mLevel: number, uLevel: number): number {
  return Math.log2(mLevel / uLevel);
}
