export interface PrecisionRecall {
  precision: number;
  recall: number;
  f1: number;
}

/** F1 as the harmonic mean; 0 when both are 0. */
export function f1Of(precision: number, recall: number): number {
  return precision + recall === 0 ? 0 : (2 * precision * recall) / (precision + recall);
}
