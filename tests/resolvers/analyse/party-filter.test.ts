/** Roles are not parties unless the contract binds them (issue 16 item 3). Role words: common practice; data-protection roles: GDPR Art. 4 and 28. */
import { describe, expect, it } from 'vitest';
import { analyseName } from '../../../resolvers/analyse/index.ts';
import { partyVerdict } from '../../../resolvers/analyse/party-filter.ts';

describe('partyFilter: roles', () => {
  it('data-protection roles need binding like "the Licensee"', () => {
    for (const p of [
      'the Controller',
      'the Processor',
      'the Sub-processor',
      'Subprocessor',
      'the Joint Controller',
      'the Data Exporter',
      'Data Importer',
      'the Data Subject',
      'the Licensee',
    ]) {
      const a = analyseName(p);
      expect(a.partyStatus, p).toBe('needs_binding');
      expect(a.partyReason, p).toBe('role_word');
    }
  });

  it('other role words need binding too', () => {
    for (const p of [
      'the Paying Agent',
      'the Sublicensee',
      'the Chargor',
      'the Transferee',
      'the Insurer',
      'the Service Provider',
      'the Security Trustee',
      'the Administrator',
    ]) {
      expect(analyseName(p).partyStatus, p).toBe('needs_binding');
    }
  });

  it('a legal form or a name word keeps a party (invented names)', () => {
    // "Exclusive Partners"-like firm names are in the LEI data (shared/datasets/lei_org_names_dev.csv).
    for (const p of ['Processor Holdings Ltd', 'Controller Marlow GmbH', 'Brightwater Processor Works', 'Exclusive Partners', 'Lead Partners']) {
      expect(analyseName(p).partyStatus, p).toBe('party');
    }
  });

  it('verdict order: pronoun before place ("US" is "us"), place and document before role', () => {
    expect(partyVerdict('US', ['us'], false)).toEqual({ status: 'needs_binding', reason: 'pronoun' });
    expect(partyVerdict('the Services', ['the', 'services'], false)).toEqual({ status: 'not_a_party', reason: 'document' });
    expect(partyVerdict('the Territory', ['the', 'territory'], false)).toEqual({ status: 'not_a_party', reason: 'document' });
    expect(partyVerdict('the Kingdom of Spain', ['the', 'kingdom', 'of', 'spain'], false)).toEqual({ status: 'not_a_party', reason: 'place' });
  });
});
