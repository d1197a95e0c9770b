/** The register's one door to name analysis (resolvers/analyse): every stored or resolved name goes through it. */
import { analyseName } from '../../../resolvers/analyse/index.ts';
import type { NameAnalysis } from '../../../resolvers/analyse/types.ts';

export function analyse(text: string, country?: string | null): NameAnalysis {
  return analyseName(text, country ? { country } : undefined);
}
