import { describe, expect, it } from 'vitest';
import { estimateModel, labelledPairsOf, MIN_REVIEW_BAND } from '../../../services/evaluate/train-model.ts';
import { DEFAULT_MATCH_MODEL } from '../../../resolvers/score/index.ts';
import type { LabelledRow } from '../../../services/evaluate/load-labelled-csv.ts';

// Invented names only: each firm written twice (one entity), and a holding company of each (another entity) whose
// name adds a word, the kind of near miss a person is asked about.
const STEMS = [
  'Aldermoor',
  'Brenthulme',
  'Corvadine',
  'Dunmarrow',
  'Elsquarry',
  'Fenwortle',
  'Garrowick',
  'Hollenby',
  'Istravane',
  'Jorvelle',
  'Kestramoor',
  'Lindqvarn',
];
const TRADES = ['Quarry', 'Timber', 'Ceramics'];

function rows(): LabelledRow[] {
  const out: LabelledRow[] = [];
  const add = (id: string, name: string) => out.push({ line: out.length + 2, id, name, originalName: name, country: 'GB', fields: {} });
  for (const stem of STEMS) {
    for (const trade of TRADES) {
      add(`${stem}-${trade}`, `${stem} ${trade} Ltd`);
      add(`${stem}-${trade}`, `${stem.toUpperCase()} ${trade.toUpperCase()} LIMITED`);
      add(`${stem}-${trade}-holding`, `${stem} ${trade} Holdings Ltd`);
    }
  }
  return out;
}

describe('estimateModel: the review band', () => {
  it('stays at least MIN_REVIEW_BAND bits wide when no floor holds half true matches', () => {
    const set = labelledPairsOf({ name: 'invented', rows: rows() });
    const model = estimateModel([set], { linkPrecision: 0.99, reviewMatchShare: 0.5 }, 'test', DEFAULT_MATCH_MODEL);
    // Every near miss here is another entity, so the share rule alone would put newAt at linkAt (no review at all).
    expect(model.linkAt).toBeLessThan(16);
    expect(model.newAt).toBeCloseTo(model.linkAt - MIN_REVIEW_BAND, 3);
    expect(model.provenance.note).toContain(`newAt at most linkAt - ${MIN_REVIEW_BAND}`);
  });
});
