/**
 * The first column name a CSV header holds twice, with both 1-based positions; undefined when every name is unique.
 * Empty names are not compared: spreadsheets often end a header with empty cells, which no mapping can name.
 */
export function duplicateColumn(header: readonly string[]): { name: string; first: number; second: number } | undefined {
  const seen = new Map<string, number>();
  for (const [i, name] of header.entries()) {
    if (name === '') continue;
    const earlier = seen.get(name);
    if (earlier !== undefined) return { name, first: earlier + 1, second: i + 1 };
    seen.set(name, i);
  }
  return undefined;
}
