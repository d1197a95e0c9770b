/**
 * The German umlaut transcription (ä=ae, ö=oe, ü=ue, DIN 5007-2; from memory) folds only where a word can hold an
 * umlaut: after a consonant other than q, not at the word's end nor before a final l or s (issue 15: "Samuel Blue"
 * folded to "samul blu"). Names are invented; the word lists are from memory.
 */
import { describe, expect, it } from 'vitest';
import { ANALYSIS_VERSION, analyseName, foldGermanDigraphs, normaliseName } from '../../../resolvers/analyse/index.ts';

describe('German digraph folding', () => {
  it('still folds German transcriptions inside a word, so both spellings meet', () => {
    // ü/ö/ä written out (DIN 5007-2, from memory) against the letter itself, folded to the same form.
    expect(normaliseName('Gruenholt Mueller GmbH')).toBe(normaliseName('Grünholt Müller GmbH'));
    expect(normaliseName('Gruenholt Mueller GmbH')).toBe('grunholt muller gmbh');
    expect(normaliseName('Schroeder Baeckerei Suedhang')).toBe('schroder backerei sudhang');
    expect(normaliseName('Koenigsfeld Jaeger KG')).toBe(normaliseName('Königsfeld Jäger KG'));
    // Word-final "ue" before another consonant than l or s is still an umlaut ("Sued" is "Süd").
    expect(foldGermanDigraphs('sued')).toBe('sud');
  });

  it('leaves English, French and Spanish words and given names alone', () => {
    expect(normaliseName('Samuel Blue')).toBe('samuel blue');
    expect(normaliseName('Manuel Avenue Values Ltd')).toBe('manuel avenue values ltd');
    expect(normaliseName('Joe Noel Michael & Rafael')).toBe('joe noel michael and rafael');
    expect(analyseName('Samuel Blue Trading Ltd').core).toBe('samuel blue trading');
  });

  it('keeps the rules it had: no fold after a vowel (a diphthong) or after q', () => {
    expect(normaliseName('Bauer Steuer Quelle')).toBe('bauer steuer quelle');
  });

  it('is idempotent', () => {
    for (const word of ['muehlberg', 'samuel', 'bluevue', 'xuee', 'sued', 'values', 'goethe']) {
      const once = foldGermanDigraphs(word);
      expect(foldGermanDigraphs(once)).toBe(once);
    }
  });

  it('is version 2 of the analysis (the fold changed what stored names analyse to)', () => {
    expect(ANALYSIS_VERSION).toBeGreaterThanOrEqual(2);
  });
});
