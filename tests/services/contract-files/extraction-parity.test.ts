/**
 * Parties parsed from extracted text equal those parsed from the plain text, over the demo scenario's invented
 * contracts in every drafting style: each is written as a PDF by pdf-lib (lines wrapped at 95 characters, as a page
 * holds them, blank lines kept as empty lines) and as a Word file by the `docx` package (one paragraph a line),
 * then read back by cpreg's extraction (unpdf, mammoth, which joins the lines the page wrapped again). Both are held
 * to the parties parsed from the contract's own plain text.
 */
import { describe, expect, it } from 'vitest';
import { parseParties } from '../../../resolvers/terms/index.ts';
import { extractDocxText, extractPdfText } from '../../../services/contract-files/extract-text.ts';
import { DRAFTING_STYLES, generateScenario } from '../../../services/demo/scenario/index.ts';
import { contractPdf, docxFile } from './support.ts';

const PER_STYLE = 3;

const partiesOf = (text: string) =>
  parseParties(text).parties.map((p) => ({ name: p.name, role: p.role, terms: p.terms, jurisdiction: p.jurisdiction, identifiers: p.identifiers }));

describe('extraction parity over the demo scenario', () => {
  const contracts = generateScenario(1).contracts;
  for (const style of DRAFTING_STYLES) {
    it(`${style}: PDF (pdf-lib) and Word (docx) give the parties of the plain text`, async () => {
      const sample = contracts.filter((c) => c.style === style).slice(0, PER_STYLE);
      expect(sample).toHaveLength(PER_STYLE);
      for (const c of sample) {
        const reference = partiesOf(c.text);
        expect(reference.length, c.externalId).toBeGreaterThanOrEqual(2);
        const pdf = await extractPdfText(await contractPdf(c.text)); // pdf-lib, as a page holds the lines
        expect(pdf.ok && partiesOf(pdf.text), `${c.externalId} from PDF`).toEqual(reference);
        const word = await extractDocxText(await docxFile(c.text)); // docx
        expect(word.ok && partiesOf(word.text), `${c.externalId} from Word`).toEqual(reference);
      }
    });
  }
});
