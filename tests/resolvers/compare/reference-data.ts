// Reads the shared reference file in place (never copied into the repository): ../shared/reference/worked-examples.json.
import { readFileSync } from 'node:fs';

const url = new URL('../../../../shared/reference/worked-examples.json', import.meta.url);
export const workedExamples = JSON.parse(readFileSync(url, 'utf8')) as Record<string, any>;
