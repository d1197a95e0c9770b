// Our small layout for the network view: the counterparty in the middle, its contracts on an inner ring,
// the other parties on an outer ring near the contracts they share, related counterparties among them.
// Pure: data in, positions out (no DOM), so that it can be read and tested on its own.

const TAU = Math.PI * 2;

/**
 * Spreads angles so that neighbours around the circle are at least `gap` apart, keeping their order and their
 * mean (a crowd of parties at one contract fans out around it instead of piling up).
 */
export function spreadAngles(angles, gap) {
  const n = angles.length;
  if (n === 0) return [];
  if (gap * n >= TAU) return angles.map((_, i) => (i * TAU) / n);
  const sorted = angles.map((a, i) => ({ a: ((a % TAU) + TAU) % TAU, i })).sort((x, y) => x.a - y.a);
  // Cut the circle at its widest empty stretch, so the run to spread has no wrap-around inside it.
  let cut = 0;
  let widest = sorted[0].a + TAU - sorted[n - 1].a;
  for (let k = 1; k < n; k++) {
    if (sorted[k].a - sorted[k - 1].a > widest) {
      widest = sorted[k].a - sorted[k - 1].a;
      cut = k;
    }
  }
  const order = [...sorted.slice(cut), ...sorted.slice(0, cut).map((o) => ({ a: o.a + TAU, i: o.i }))];
  let out = order.map((o) => o.a);
  for (let k = 1; k < n; k++) if (out[k] - out[k - 1] < gap) out[k] = out[k - 1] + gap;
  // Pushing moved the run forward: move it back so its mean is where the wanted angles' mean was.
  const shift = order.reduce((sum, o) => sum + o.a, 0) / n - out.reduce((sum, a) => sum + a, 0) / n;
  out = out.map((a) => a + shift);
  // A run that reaches round to its own start is spaced evenly instead.
  if (out[n - 1] - out[0] > TAU - gap) out = out.map((_, k) => out[0] + (k * TAU) / n);
  const result = new Array(n);
  order.forEach((o, k) => (result[o.i] = out[k]));
  return result;
}

/**
 * network: the answer of GET /v1/counterparties/{id}/network. Returns nodes { key, kind: 'self'|'contract'|
 * 'counterparty'|'own', id, label, x, y, href? } and edges { from, to, kind: 'party'|'relation', label }.
 */
export function layoutNetwork(network, { width = 900, height = 640, maxContracts = 40 } = {}) {
  const cx = width / 2;
  const cy = height / 2;
  const inner = Math.min(width, height) * 0.24;
  const outer = Math.min(width, height) * 0.44;
  const nodes = [];
  const edges = [];
  const self = { key: `cp${network.counterparty.id}`, kind: 'self', id: network.counterparty.id, label: network.counterparty.canonicalName, x: cx, y: cy, href: `#/counterparty/${network.counterparty.id}` };
  nodes.push(self);

  const contracts = network.contracts.slice(0, maxContracts);
  const contractAngle = new Map();
  contracts.forEach((c, i) => {
    const angle = -Math.PI / 2 + (i * TAU) / Math.max(1, contracts.length);
    contractAngle.set(c.contractId, angle);
    const key = `k${c.contractId}`;
    nodes.push({ key, kind: 'contract', id: c.contractId, label: c.title ?? c.externalId, detail: `${c.externalId}${c.roles.length ? ` · as ${c.roles.join(', ')}` : ''}`, x: cx + inner * Math.cos(angle), y: cy + inner * Math.sin(angle), href: `#/contract/${c.contractId}` });
    edges.push({ from: self.key, to: key, kind: 'party', label: c.roles.join(', ') });
  });

  // Each other party once, wherever it appears; placed at the mean angle of its contracts.
  const others = new Map();
  for (const p of network.parties) {
    if (!contractAngle.has(p.contractId)) continue;
    const key = p.counterpartyId !== null ? `cp${p.counterpartyId}` : p.ownEntityId !== null ? `own${p.ownEntityId}` : `m${p.contractId}-${p.name}`;
    const entry = others.get(key) ?? { key, kind: p.counterpartyId !== null ? 'counterparty' : 'own', id: p.counterpartyId ?? p.ownEntityId, label: p.name, contracts: [] };
    entry.contracts.push({ contractId: p.contractId, role: p.role });
    others.set(key, entry);
  }
  for (const r of network.relations ?? []) {
    const otherId = r.fromCounterpartyId === network.counterparty.id ? r.toCounterpartyId : r.fromCounterpartyId;
    const key = `cp${otherId}`;
    if (!others.has(key)) others.set(key, { key, kind: 'counterparty', id: otherId, label: `counterparty #${otherId}`, contracts: [] });
    edges.push({ from: r.fromCounterpartyId === network.counterparty.id ? self.key : key, to: r.fromCounterpartyId === network.counterparty.id ? key : self.key, kind: 'relation', label: r.type.replaceAll('_', ' ') });
  }
  const list = [...others.values()];
  const wanted = list.map((o, i) => {
    if (o.contracts.length === 0) return (i / Math.max(1, list.length)) * TAU;
    const xs = o.contracts.map((c) => Math.cos(contractAngle.get(c.contractId)));
    const ys = o.contracts.map((c) => Math.sin(contractAngle.get(c.contractId)));
    return Math.atan2(ys.reduce((a, b) => a + b, 0), xs.reduce((a, b) => a + b, 0));
  });
  const angles = spreadAngles(wanted, Math.min(0.5, TAU / Math.max(1, list.length)));
  list.forEach((o, i) => {
    nodes.push({ key: o.key, kind: o.kind, id: o.id, label: o.label, x: cx + outer * Math.cos(angles[i]), y: cy + outer * Math.sin(angles[i]), href: o.kind === 'counterparty' ? `#/counterparty/${o.id}` : undefined, detail: o.kind === 'own' ? 'our own entity' : undefined });
    for (const c of o.contracts) edges.push({ from: `k${c.contractId}`, to: o.key, kind: 'party', label: c.role ?? '' });
  });
  return { nodes, edges, width, height, shownContracts: contracts.length, totalContracts: network.contracts.length };
}
