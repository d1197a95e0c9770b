/**
 * Builds resolvers/analyse/elf-table.json from the ISO 20275 ELF code list (GLEIF v1.5, CC0 1.0).
 * Usage: node bin/run-ts.js scripts/build-elf-table.ts [path/to/iso20275-elf-code-list.csv]
 * Default input: ../shared/reference/iso20275-elf-code-list.csv (relative to the repository).
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
// The table builder stays out of the analyse stage's public surface: only this build script needs it (and csv-parse).
// eslint-disable-next-line no-restricted-imports
import { buildElfTable, serialiseElfTable } from '../resolvers/analyse/build-elf-table.ts';

const input = resolve(process.argv[2] ?? '../shared/reference/iso20275-elf-code-list.csv');
const output = resolve('resolvers/analyse/elf-table.json');

let csv: string;
try {
  csv = readFileSync(input, 'utf8');
} catch (error) {
  console.error(`build-elf-table: cannot read the ELF CSV at ${input}: ${(error as Error).message}`);
  process.exit(1);
}
const table = buildElfTable(csv);
writeFileSync(output, serialiseElfTable(table));
console.log(`build-elf-table: ${Object.keys(table.forms).length} designators, ${Object.keys(table.codes).length} codes → resolvers/analyse/elf-table.json`);
