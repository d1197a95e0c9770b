/** The network layout labels a related counterparty with the canonical name the API answers for the relation. */
import { describe, expect, it } from 'vitest';
import { layoutNetwork, type NetworkAnswer } from '../../../services/console/static/graph-layout.js';

describe('layoutNetwork: related counterparties by name', () => {
  const network: NetworkAnswer = {
    counterparty: { id: 7, canonicalName: 'Invented Alpha GmbH' },
    contracts: [],
    parties: [],
    relations: [
      { fromCounterpartyId: 7, toCounterpartyId: 12, type: 'parent_of', relatedCounterpartyId: 12, relatedCanonicalName: 'Invented Alpha Werkzeuge GmbH' },
      { fromCounterpartyId: 15, toCounterpartyId: 7, type: 'successor_of' },
    ],
  };

  it('uses relatedCanonicalName, and an id label only when an answer lacks it', () => {
    const layout = layoutNetwork(network, { width: 800, height: 600 });
    expect(layout.nodes.find((n) => n.key === 'cp12')).toMatchObject({ label: 'Invented Alpha Werkzeuge GmbH', href: '#/counterparty/12' });
    expect(layout.nodes.find((n) => n.key === 'cp15')).toMatchObject({ label: 'counterparty #15' });
  });
});
