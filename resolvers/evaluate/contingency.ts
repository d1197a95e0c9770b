/**
 * The contingency table between a gold partition and a predicted partition of the same items: the one
 * structure every clustering metric here is computed from, so that no metric enumerates item pairs.
 */
export interface Contingency {
  /** Number of items. */
  n: number;
  /** Size of each gold cluster. */
  goldSizes: number[];
  /** Size of each predicted cluster. */
  predictedSizes: number[];
  /** Non-empty cells: items in gold cluster `gold` and predicted cluster `predicted`. */
  cells: { gold: number; predicted: number; count: number }[];
}

/**
 * Builds the table from two label arrays aligned by item (labels are any strings or numbers;
 * only equality matters). Throws when the arrays differ in length: the two sides must label the same items.
 */
export function contingency(gold: readonly (string | number)[], predicted: readonly (string | number)[]): Contingency {
  if (gold.length !== predicted.length) {
    throw new Error(`contingency: ${gold.length} gold labels but ${predicted.length} predicted labels; label the same items`);
  }
  const goldIndex = new Map<string | number, number>();
  const predIndex = new Map<string | number, number>();
  const goldSizes: number[] = [];
  const predictedSizes: number[] = [];
  const cellCounts = new Map<string, { gold: number; predicted: number; count: number }>();
  for (let i = 0; i < gold.length; i++) {
    const g = indexOf(goldIndex, goldSizes, gold[i] as string | number);
    const p = indexOf(predIndex, predictedSizes, predicted[i] as string | number);
    const key = `${g}:${p}`;
    const cell = cellCounts.get(key);
    if (cell) cell.count++;
    else cellCounts.set(key, { gold: g, predicted: p, count: 1 });
  }
  return { n: gold.length, goldSizes, predictedSizes, cells: [...cellCounts.values()] };
}

function indexOf(index: Map<string | number, number>, sizes: number[], label: string | number): number {
  let at = index.get(label);
  if (at === undefined) {
    at = sizes.length;
    index.set(label, at);
    sizes.push(0);
  }
  sizes[at] = (sizes[at] as number) + 1;
  return at;
}

/** n choose 2. */
export function pairsOf(n: number): number {
  return (n * (n - 1)) / 2;
}
