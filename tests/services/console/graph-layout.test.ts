/** The network view's layout helper (services/console/static/graph-layout.js): pure geometry, no browser. */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { layoutNetwork, spreadAngles, spreadLine, type NetworkAnswer } from '../../../services/console/static/graph-layout.js';

const TAU = Math.PI * 2;

/** Angular distance on the circle (common practice: the shorter way round). */
function circular(a: number, b: number): number {
  const d = Math.abs(a - b) % TAU;
  return Math.min(d, TAU - d);
}

describe('spreadAngles', () => {
  it('keeps neighbours at least the gap apart and keeps their order', () => {
    fc.assert(
      // Whole milliradians within one turn: equal inputs are equal after the layout's own normalisation too.
      fc.property(
        fc.array(
          fc.integer({ min: 0, max: 6283 }).map((m) => m / 1000),
          { minLength: 1, maxLength: 30 },
        ),
        (angles) => {
          const gap = TAU / (angles.length * 2);
          const out = spreadAngles(angles, gap);
          expect(out).toHaveLength(angles.length);
          for (let i = 0; i < out.length; i++) for (let j = i + 1; j < out.length; j++) expect(circular(out[i]!, out[j]!)).toBeGreaterThanOrEqual(gap * 0.999);
          // Order kept round the circle: walking the inputs in angle order, the outputs turn one way only,
          // less than one full turn in all.
          const byWanted = angles.map((a, i) => ({ a, i })).sort((x, y) => x.a - y.a || x.i - y.i);
          const spread = byWanted.map(({ i }) => out[i]!);
          let turned = 0;
          for (let k = 1; k < spread.length; k++) turned += (((spread[k]! - spread[k - 1]!) % TAU) + TAU) % TAU;
          expect(turned).toBeLessThan(TAU + 1e-9);
        },
      ),
    );
  });

  it('moves nothing that is already apart, and fans out a pile around where it was', () => {
    expect(spreadAngles([0, 2, 4], 0.5)).toEqual([0, 2, 4]);
    const fanned = spreadAngles([1, 1, 1], 0.4);
    // Three at 1 rad with a gap of 0.4 become 0.6, 1.0, 1.4 (mean kept at 1; worked by hand).
    expect(fanned.map((a) => Number(a.toFixed(6))).sort()).toEqual([0.6, 1, 1.4]);
  });
});

describe('spreadLine', () => {
  it('keeps neighbours the gap apart around their mean', () => {
    // Worked by hand: 0, 0, 10 with a gap of 46 become 0, 46, 92 shifted by -128/3 to keep the mean 10/3.
    const out = spreadLine([0, 0, 10], 46);
    expect(out.map((v) => Number(v.toFixed(6)))).toEqual([-42.666667, 3.333333, 49.333333]);
    expect(spreadLine([0, 100, 200], 46)).toEqual([0, 100, 200]);
  });
});

describe('layoutNetwork', () => {
  const network: NetworkAnswer = {
    counterparty: { id: 7, canonicalName: 'Invented Alpha GmbH' },
    contracts: [
      { contractId: 1, externalId: 'C-1', title: 'Supply Agreement', roles: ['Supplier'] },
      { contractId: 2, externalId: 'C-2', title: null, roles: ['Seller'] },
    ],
    parties: [
      { contractId: 1, role: 'Buyer', counterpartyId: 9, ownEntityId: null, name: 'Invented Beta Ltd' },
      { contractId: 2, role: 'Buyer', counterpartyId: 9, ownEntityId: null, name: 'Invented Beta Ltd' },
      { contractId: 2, role: 'Guarantor', counterpartyId: null, ownEntityId: 3, name: 'Our Holding B.V.' },
    ],
    relations: [{ fromCounterpartyId: 7, toCounterpartyId: 12, type: 'parent_of' }],
  };

  it('puts the counterparty in the middle, each contract and each other party once, and links them', () => {
    const layout = layoutNetwork(network, { width: 800, height: 600 });
    const self = layout.nodes[0]!;
    expect(self).toMatchObject({ kind: 'self', id: 7, x: 400, y: 300, href: '#/counterparty/7' });
    expect(layout.nodes.map((n) => n.key).sort()).toEqual(['cp12', 'cp7', 'cp9', 'k1', 'k2', 'own3']);
    const keys = new Set(layout.nodes.map((n) => n.key));
    for (const edge of layout.edges) {
      expect(keys.has(edge.from)).toBe(true);
      expect(keys.has(edge.to)).toBe(true);
    }
    // Beta is a party to both contracts: two edges, one node.
    expect(layout.edges.filter((e) => e.to === 'cp9')).toHaveLength(2);
    expect(layout.edges.find((e) => e.kind === 'relation')).toMatchObject({ from: 'cp7', to: 'cp12', label: 'parent of' });
    // Own entities are drawn but are not links; counterparties and contracts are.
    expect(layout.nodes.find((n) => n.key === 'own3')!.href).toBeUndefined();
    expect(layout.nodes.find((n) => n.key === 'k2')).toMatchObject({ label: 'C-2', href: '#/contract/2' });
    // Contracts on the inner ring, other parties on the outer ring.
    const radius = (key: string) => {
      const n = layout.nodes.find((x) => x.key === key)!;
      return Math.hypot(n.x - self.x, n.y - self.y);
    };
    expect(radius('k1')).toBeCloseTo(radius('k2'), 6);
    expect(radius('cp9')).toBeGreaterThan(radius('k1'));
  });

  it('puts many contracts in a column, one per row, with the other parties beside theirs, all inside the bounds', () => {
    const busy: NetworkAnswer = {
      counterparty: network.counterparty,
      contracts: Array.from({ length: 15 }, (_, i) => ({ contractId: i + 1, externalId: `C-${i + 1}`, title: 'Supply Agreement', roles: ['Supplier'] })),
      parties: Array.from({ length: 15 }, (_, i) => ({
        contractId: i + 1,
        role: 'Buyer',
        counterpartyId: 100 + (i % 4),
        ownEntityId: null,
        name: `Invented Buyer ${i % 4}`,
      })),
    };
    const layout = layoutNetwork(busy, { width: 1000, labelRoom: 200 });
    const contracts = layout.nodes.filter((n) => n.kind === 'contract');
    const others = layout.nodes.filter((n) => n.kind === 'counterparty');
    expect(new Set(contracts.map((n) => n.x)).size).toBe(1);
    expect(others).toHaveLength(4);
    const gaps = (ys: number[]) =>
      ys
        .sort((a, b) => a - b)
        .slice(1)
        .map((y, i) => y - ys[i]!);
    for (const gap of [...gaps(contracts.map((n) => n.y)), ...gaps(others.map((n) => n.y))]) expect(gap).toBeGreaterThanOrEqual(45.999);
    const { x, y, width, height } = layout.bounds;
    for (const n of layout.nodes) {
      expect(n.x).toBeGreaterThanOrEqual(x);
      expect(n.x).toBeLessThanOrEqual(x + width);
      expect(n.y).toBeGreaterThanOrEqual(y);
      expect(n.y).toBeLessThanOrEqual(y + height);
    }
  });

  it('shows at most maxContracts contracts and says how many there are', () => {
    const many: NetworkAnswer = {
      counterparty: network.counterparty,
      contracts: Array.from({ length: 12 }, (_, i) => ({ contractId: i + 1, externalId: `C-${i + 1}`, title: null, roles: [] })),
      parties: [],
    };
    const layout = layoutNetwork(many, { maxContracts: 5 });
    expect(layout.shownContracts).toBe(5);
    expect(layout.totalContracts).toBe(12);
    expect(layout.nodes.filter((n) => n.kind === 'contract')).toHaveLength(5);
  });
});
