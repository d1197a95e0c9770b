// The network view: the counterparty, its contracts and the other parties of those contracts, in SVG.
// Every counterparty and contract node is a link: click it (or Tab to it and press Enter) to open it.
import { api } from '../api.js';
import { h, pageTitle, plural, replace, s } from '../dom.js';
import { section } from '../ui.js';
import { layoutNetwork } from '../graph-layout.js';

const NODE_R = { self: 26, contract: 13, counterparty: 15, own: 15 };

let labelLength = 26;

function shortLabel(text, max = labelLength) {
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

/** Up to `maxLines` lines of about `width` characters, breaking between words (the last one shortened). */
function wrapWords(text, width, maxLines) {
  const lines = [];
  let line = '';
  for (const word of text.split(' ')) {
    if (line && (line + ' ' + word).length > width) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  if (lines.length <= maxLines) return lines;
  return [...lines.slice(0, maxLines - 1), shortLabel(lines.slice(maxLines - 1).join(' '), width)];
}

function drawNode(node, cx) {
  const r = NODE_R[node.kind];
  const shape =
    node.kind === 'contract' ? s('rect', { x: node.x - r, y: node.y - r, width: 2 * r, height: 2 * r, rx: 3 }) : s('circle', { cx: node.x, cy: node.y, r });
  // Labels sit outside the rings (left half: anchored at their end) so they do not cross the middle.
  const right = node.labelAt ? node.labelAt === 'right' : node.x >= cx;
  const side = { x: node.x + (right ? r + 5 : -r - 5), 'text-anchor': right ? 'start' : 'end' };
  const label =
    node.kind === 'self'
      ? node.labelAt === 'left'
        ? wrapWords(node.label, 20, 3).map((line, i, lines) =>
            s('text', { x: node.x - r - 8, y: node.y + 6 + (i - (lines.length - 1) / 2) * 19, 'text-anchor': 'end', class: 'node-label self-label' }, line),
          )
        : s('text', { x: node.x, y: node.y + r + 18, 'text-anchor': 'middle', class: 'node-label self-label' }, shortLabel(node.label, 40))
      : [
          s('text', { ...side, y: node.y + (node.detail ? -1 : 4), class: 'node-label' }, shortLabel(node.label)),
          node.detail ? s('text', { ...side, y: node.y + 13, class: 'node-detail' }, shortLabel(node.detail, labelLength + 8)) : null,
        ];
  const title = s('title', null, `${node.label}${node.detail ? ` — ${node.detail}` : ''}`);
  const group = [title, shape, label];
  const cls = `node node-${node.kind}`;
  if (node.href)
    return s(
      'a',
      { href: node.href, class: cls, 'aria-label': `${node.kind === 'contract' ? 'contract' : 'counterparty'}: ${node.label}`, dataset: { node: node.key } },
      group,
    );
  return s('g', { class: cls, dataset: { node: node.key } }, group);
}

export async function render(main, { params }) {
  const id = Number(params[0]);
  const { data } = await api(`/v1/counterparties/${id}/network`);
  // Relations carry the related counterparty's canonical name (relatedCanonicalName); the layout labels them.
  if (data.counterparty.id !== id) history.replaceState(null, '', `#/network/${data.counterparty.id}`);
  // A narrow window gets a portrait layout with shorter labels, drawn at a readable size inside a pane
  // that scrolls sideways (the page itself does not).
  const compact = main.clientWidth < 700;
  const layout = compact ? layoutNetwork(data, { width: 520, height: 760, labelRoom: 150 }) : layoutNetwork(data, { width: 1000, height: 720, labelRoom: 215 });
  labelLength = compact ? 18 : 26;
  const box = layout.bounds;
  const at = new Map(layout.nodes.map((n) => [n.key, n]));
  const svg = s(
    'svg',
    {
      viewBox: `${box.x} ${box.y} ${box.width} ${box.height}`,
      class: compact ? 'network compact' : 'network',
      id: 'network-graph',
      role: 'group',
      'aria-label': `Network of ${data.counterparty.canonicalName}`,
    },
    s(
      'g',
      { class: 'edges' },
      layout.edges.map((e) => {
        const a = at.get(e.from);
        const b = at.get(e.to);
        if (!a || !b) return null;
        const line = s('line', { x1: a.x, y1: a.y, x2: b.x, y2: b.y, class: `edge edge-${e.kind}` }, s('title', null, e.label));
        // Relations are few and say something a contract edge does not: their type is written on them.
        return e.kind === 'relation'
          ? [line, s('text', { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 - 4, 'text-anchor': 'middle', class: 'edge-label' }, e.label)]
          : line;
      }),
    ),
    s(
      'g',
      { class: 'nodes' },
      layout.nodes.map((n) => drawNode(n, layout.width / 2)),
    ),
  );
  // Never drawn larger than 1:1 (text stays at its set size); narrow windows scroll a pane at up to 1:1.
  svg.style.maxWidth = `${Math.round(box.width)}px`;
  if (compact) svg.style.minWidth = `${Math.round(Math.min(box.width, 640))}px`;
  const counterparties = layout.nodes.filter((n) => n.kind === 'counterparty');
  const own = layout.nodes.filter((n) => n.kind === 'own');
  replace(
    main,
    h(
      'p',
      { class: 'crumbs' },
      h('a', { href: '#/search' }, 'Search'),
      ' › ',
      h('a', { href: `#/counterparty/${data.counterparty.id}` }, data.counterparty.canonicalName),
      ' › network',
    ),
    pageTitle(`Who contracts with ${data.counterparty.canonicalName}`),
    h(
      'p',
      { class: 'legend' },
      h('span', { class: 'key key-self' }),
      ' this counterparty  ',
      h('span', { class: 'key key-contract' }),
      ' contract  ',
      h('span', { class: 'key key-counterparty' }),
      ' other counterparty  ',
      h('span', { class: 'key key-own' }),
      ' our own entity  ',
      h('span', { class: 'key key-relation' }),
      ' relation',
    ),
    layout.shownContracts < layout.totalContracts
      ? h('p', { class: 'muted' }, `Showing ${layout.shownContracts} of ${layout.totalContracts} contracts.`)
      : null,
    h('div', { class: 'network-wrap', tabindex: compact ? '0' : null, 'aria-label': compact ? 'network drawing (scrolls sideways)' : null }, svg),
    section(
      'The same, as a list',
      h(
        'p',
        null,
        `${plural(layout.totalContracts, 'contract')}, ${plural(counterparties.length, 'other counterparty', 'other counterparties')}, ${plural(own.length, 'own entity', 'own entities')}.`,
      ),
      (data.relations ?? []).length
        ? h(
            'p',
            null,
            'Relations: ',
            data.relations.flatMap((r, i) => {
              const outgoing = r.fromCounterpartyId === data.counterparty.id;
              const other = outgoing ? r.toCounterpartyId : r.fromCounterpartyId;
              const name = r.relatedCanonicalName ?? `#${other}`;
              return [
                i ? '; ' : '',
                outgoing ? `${r.type.replaceAll('_', ' ')} ` : `${r.type.replaceAll('_', ' ')} (from) `,
                h('a', { href: `#/counterparty/${other}` }, name),
              ];
            }),
          )
        : null,
      h(
        'ul',
        { class: 'plain-list' },
        data.contracts.map((c) =>
          h(
            'li',
            null,
            h('a', { href: `#/contract/${c.contractId}` }, c.title ?? c.externalId),
            ` (${c.externalId}) as ${c.roles.join(', ') || '—'}: `,
            data.parties
              .filter((p) => p.contractId === c.contractId)
              .flatMap((p, i) => [
                i ? '; ' : '',
                p.counterpartyId ? h('a', { href: `#/counterparty/${p.counterpartyId}` }, p.name) : `${p.name} (ours)`,
                p.role ? ` as ${p.role}` : '',
              ]),
          ),
        ),
      ),
    ),
  );
  const wrap = main.querySelector('.network-wrap');
  // A pane wider than the window starts where the counterparty is: the middle, or the left for columns.
  wrap.scrollLeft = layout.nodes[0].labelAt === 'left' ? 0 : (wrap.scrollWidth - wrap.clientWidth) / 2;
  main.querySelector('h1').focus();
}
