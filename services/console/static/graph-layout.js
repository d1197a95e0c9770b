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

/** Spreads positions on a line so that neighbours are at least `gap` apart, keeping order and mean. */
export function spreadLine(values, gap) {
  const order = values.map((v, i) => ({ v, i })).sort((a, b) => a.v - b.v || a.i - b.i);
  const out = order.map((o) => o.v);
  for (let k = 1; k < out.length; k++) if (out[k] - out[k - 1] < gap) out[k] = out[k - 1] + gap;
  const shift = order.reduce((sum, o) => sum + o.v, 0) / Math.max(1, out.length) - out.reduce((sum, v) => sum + v, 0) / Math.max(1, out.length);
  const result = new Array(out.length);
  order.forEach((o, k) => (result[o.i] = out[k] + shift));
  return result;
}

/** The nodes and edges of the network answer, before placing: the counterparty, its contracts, the others. */
function collect(network, maxContracts) {
  const selfKey = `cp${network.counterparty.id}`;
  const contracts = network.contracts.slice(0, maxContracts).map((c) => ({
    key: `k${c.contractId}`,
    kind: 'contract',
    id: c.contractId,
    label: c.title ?? c.externalId,
    detail: `${c.externalId}${c.roles.length ? ` · as ${c.roles.join(', ')}` : ''}`,
    href: `#/contract/${c.contractId}`,
  }));
  const shown = new Set(contracts.map((c) => c.id));
  const edges = contracts.map((c, i) => ({ from: selfKey, to: c.key, kind: 'party', label: network.contracts[i].roles.join(', ') }));
  // Each other party once, wherever it appears.
  const others = new Map();
  for (const p of network.parties) {
    if (!shown.has(p.contractId)) continue;
    const key = p.counterpartyId !== null ? `cp${p.counterpartyId}` : p.ownEntityId !== null ? `own${p.ownEntityId}` : `m${p.contractId}-${p.name}`;
    const entry = others.get(key) ?? {
      key,
      kind: p.counterpartyId !== null ? 'counterparty' : 'own',
      id: p.counterpartyId ?? p.ownEntityId,
      label: p.name,
      contractIds: [],
    };
    entry.contractIds.push(p.contractId);
    edges.push({ from: `k${p.contractId}`, to: key, kind: 'party', label: p.role ?? '' });
    others.set(key, entry);
  }
  for (const r of network.relations ?? []) {
    const outgoing = r.fromCounterpartyId === network.counterparty.id;
    const otherId = outgoing ? r.toCounterpartyId : r.fromCounterpartyId;
    const key = `cp${otherId}`;
    if (!others.has(key))
      others.set(key, { key, kind: 'counterparty', id: otherId, label: r.relatedCanonicalName ?? `counterparty #${otherId}`, contractIds: [] });
    edges.push({ from: outgoing ? selfKey : key, to: outgoing ? key : selfKey, kind: 'relation', label: r.type.replaceAll('_', ' ') });
  }
  const list = [...others.values()].map((o) => ({
    key: o.key,
    kind: o.kind,
    id: o.id,
    label: o.label,
    contractIds: o.contractIds,
    href: o.kind === 'counterparty' ? `#/counterparty/${o.id}` : undefined,
    detail: o.kind === 'own' ? 'our own entity' : undefined,
  }));
  const self = {
    key: selfKey,
    kind: 'self',
    id: network.counterparty.id,
    label: network.counterparty.canonicalName,
    href: `#/counterparty/${network.counterparty.id}`,
  };
  return { self, contracts, others: list, edges };
}

/** Few contracts: the counterparty in the middle, contracts on an inner ring, the others outside near theirs. */
function radial(parts, { width, height, labelRoom }) {
  const cx = width / 2;
  const cy = height / 2;
  const inner = Math.min(width, height) * 0.24;
  const outer = Math.min(width, height) * 0.44;
  const angleOf = new Map();
  parts.contracts.forEach((c, i) => {
    const angle = -Math.PI / 2 + (i * TAU) / Math.max(1, parts.contracts.length);
    angleOf.set(c.id, angle);
    Object.assign(c, { x: cx + inner * Math.cos(angle), y: cy + inner * Math.sin(angle) });
  });
  const wanted = parts.others.map((o, i) => {
    if (o.contractIds.length === 0) return (i / Math.max(1, parts.others.length)) * TAU;
    const x = o.contractIds.reduce((sum, id) => sum + Math.cos(angleOf.get(id)), 0);
    const y = o.contractIds.reduce((sum, id) => sum + Math.sin(angleOf.get(id)), 0);
    return Math.atan2(y, x);
  });
  const angles = spreadAngles(wanted, Math.min(0.5, TAU / Math.max(1, parts.others.length)));
  parts.others.forEach((o, i) => Object.assign(o, { x: cx + outer * Math.cos(angles[i]), y: cy + outer * Math.sin(angles[i]) }));
  Object.assign(parts.self, { x: cx, y: cy, labelAt: 'below' });
  const nodes = [parts.self, ...parts.contracts, ...parts.others];
  // Labels point away from the middle, so they do not cross it.
  for (const n of nodes) if (n !== parts.self) n.labelAt = n.x >= cx ? 'right' : 'left';
  // Centred across on the counterparty with room for labels both sides; vertically only what is drawn.
  const halfX = Math.max(labelRoom * 1.7, ...nodes.map((n) => Math.abs(n.x - cx) + labelRoom));
  let y0 = Math.min(...nodes.map((n) => n.y)) - 40;
  let y1 = Math.max(...nodes.map((n) => n.y)) + 62;
  if (y1 - y0 < 320) [y0, y1] = [(y0 + y1) / 2 - 160, (y0 + y1) / 2 + 160];
  return { nodes, bounds: { x: cx - halfX, y: y0, width: 2 * halfX, height: y1 - y0 } };
}

/** Many contracts: three columns (the counterparty, its contracts one per row, the others beside theirs). */
function columns(parts, { width, labelRoom, rowHeight = 46 }) {
  const [x0, x1, x2] = [labelRoom + 20, width * 0.42, width * 0.8];
  parts.contracts.forEach((c, i) => Object.assign(c, { x: x1, y: i * rowHeight }));
  const yOf = new Map(parts.contracts.map((c) => [c.id, c.y]));
  const middle = ((parts.contracts.length - 1) * rowHeight) / 2;
  const wanted = parts.others.map((o) => (o.contractIds.length ? o.contractIds.reduce((sum, id) => sum + yOf.get(id), 0) / o.contractIds.length : middle));
  const ys = spreadLine(wanted, rowHeight);
  parts.others.forEach((o, i) => Object.assign(o, { x: x2, y: ys[i] }));
  Object.assign(parts.self, { x: x0, y: middle, labelAt: 'left' });
  const nodes = [parts.self, ...parts.contracts, ...parts.others];
  for (const n of nodes) if (n !== parts.self) n.labelAt = 'right';
  const top = Math.min(...nodes.map((n) => n.y)) - 36;
  const bottom = Math.max(...nodes.map((n) => n.y)) + 36;
  return { nodes, bounds: { x: 0, y: top, width: x2 + labelRoom + 20, height: bottom - top } };
}

/**
 * network: the answer of GET /v1/counterparties/{id}/network. Returns nodes { key, kind: 'self'|'contract'|
 * 'counterparty'|'own', id, label, detail?, x, y, href?, labelAt? }, edges { from, to, kind: 'party'|'relation',
 * label } and the bounds to draw (a radial picture up to `radialUpTo` contracts, columns beyond).
 */
export function layoutNetwork(network, { width = 900, height = 640, maxContracts = 40, labelRoom = 215, radialUpTo = 6 } = {}) {
  const parts = collect(network, maxContracts);
  const placed = parts.contracts.length <= radialUpTo ? radial(parts, { width, height, labelRoom }) : columns(parts, { width, labelRoom });
  return { ...placed, edges: parts.edges, width, height, shownContracts: parts.contracts.length, totalContracts: network.contracts.length };
}
