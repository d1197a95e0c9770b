// The two sides of a review item (the mention, or a counterparty) and the score's feature bars between them
// (pages/review.js shows them).
import { h, num, s } from '../dom.js';
import { facts } from '../ui.js';
import { legalFormOf } from './counterparty-sections.js';

const FEATURE_WORDS = {
  name: 'Name',
  legalForm: 'Legal form',
  jurisdiction: 'Jurisdiction',
  acronym: 'Acronym',
  qualifier: 'Place qualifier',
  sharedContact: 'Shared contact',
  identifier: 'Identifier',
  identifiers: 'Identifiers',
};

export function featureBars(evidence, score) {
  const features = (evidence?.features ?? []).filter((f) => typeof f.weight === 'number');
  const thresholds = evidence?.thresholds ?? {};
  if (features.length === 0) return h('p', { class: 'empty' }, evidence?.summary ?? 'No feature breakdown for this pair.');
  const extent = Math.max(1, ...features.map((f) => Math.abs(f.weight)));
  const rowH = 30;
  const labelW = 118;
  const barW = 190;
  const mid = labelW + barW / 2;
  const width = labelW + barW + 52;
  const height = features.length * rowH + 8;
  const scale = (w) => (w / extent) * (barW / 2);
  const chart = s(
    'svg',
    {
      viewBox: `0 0 ${width} ${height}`,
      class: 'bars',
      role: 'img',
      'aria-label': `Score ${num(score, 2)}: ${features.map((f) => `${FEATURE_WORDS[f.feature] ?? f.feature} ${num(f.weight, 2)}`).join(', ')}`,
    },
    s('line', { x1: mid, x2: mid, y1: 0, y2: height, class: 'axis' }),
    features.map((f, i) => {
      const y = 4 + i * rowH;
      const w = scale(f.weight);
      return s(
        'g',
        { class: `bar ${f.weight > 0 ? 'bar-for' : f.weight < 0 ? 'bar-against' : 'bar-none'}` },
        s('text', { x: 0, y: y + 17, class: 'bar-label' }, `${FEATURE_WORDS[f.feature] ?? f.feature}`),
        s('text', { x: 0, y: y + 27, class: 'bar-level' }, f.level ? String(f.level).replaceAll('_', ' ') : 'no evidence'),
        s('rect', { x: w >= 0 ? mid : mid + w, y: y + 6, width: Math.max(1, Math.abs(w)), height: rowH - 12, rx: 2 }),
        s('text', { x: labelW + barW + 6, y: y + 18, class: 'bar-value' }, f.weight > 0 ? `+${num(f.weight, 2)}` : num(f.weight, 2)),
      );
    }),
  );
  return h(
    'div',
    { class: 'score-box' },
    h(
      'p',
      { class: 'score-total' },
      'Score ',
      h('strong', { id: 'pair-score' }, num(score, 2)),
      thresholds.linkAt !== undefined
        ? h('span', { class: 'muted' }, ` · links at ${num(thresholds.linkAt)} or more, new below ${num(thresholds.newAt)}`)
        : null,
    ),
    h('p', { class: 'legend' }, h('span', { class: 'key key-for' }), ' for the same  ', h('span', { class: 'key key-against' }), ' against'),
    chart,
    evidence?.summary ? h('p', { class: 'muted small-text' }, evidence.summary) : null,
  );
}

function identifierLines(list) {
  if (!list || list.length === 0) return h('span', { class: 'muted' }, 'none');
  return h(
    'ul',
    { class: 'plain-list' },
    list.map((x) => h('li', null, h('span', { class: 'scheme' }, x.scheme), ' ', h('code', null, x.value))),
  );
}

/** The mention's legal form as the API analysed it ("B.V." · family bv), with how the matcher compared it. */
function mentionLegalForm(legalForm, level) {
  const compared = level ? ` · compared: ${String(level).replaceAll('_', ' ')}` : '';
  if (!legalForm) return `none${compared}`;
  return h('span', null, h('strong', null, legalForm.text), h('span', { class: 'muted' }, ` family ${legalForm.family}${compared}`));
}

export function mentionSide(item) {
  const m = item.mention;
  const form = (item.evidence?.features ?? []).find((f) => f.feature === 'legalForm');
  return h(
    'article',
    { class: 'side side-left', 'aria-label': 'The mention to place' },
    h('p', { class: 'side-kind' }, 'Mention as written'),
    h('h2', { class: 'side-name' }, m.text),
    facts([
      ['Legal form', mentionLegalForm(m.legalForm, form?.level)],
      ['Country', m.country ?? '—'],
      ['Address', m.address ?? '—'],
      ['Identifiers', identifierLines(m.identifiers)],
      [
        'Contract',
        m.contractId
          ? h('span', null, h('a', { href: `#/contract/${m.contractId}` }, m.contract?.externalId ?? `contract ${m.contractId}`), m.role ? ` as ${m.role}` : '')
          : '—',
      ],
      ['Source', `${m.source} · ${m.externalId}`],
    ]),
  );
}

export function counterpartySide(cp, label, cls) {
  if (!cp) return h('article', { class: `side ${cls}` }, h('p', { class: 'empty' }, 'This counterparty could not be read.'));
  const names = cp.names.filter((n) => n.name !== cp.canonicalName).slice(0, 5);
  return h(
    'article',
    { class: `side ${cls}`, 'aria-label': label },
    h('p', { class: 'side-kind' }, label),
    h('h2', { class: 'side-name' }, h('a', { href: `#/counterparty/${cp.id}` }, cp.canonicalName), h('span', { class: 'muted' }, ` #${cp.id}`)),
    facts([
      ['Legal form', legalFormOf(cp)?.toUpperCase() ?? '—'],
      ['Jurisdiction', cp.jurisdiction ?? '—'],
      ['Other names', names.length ? names.map((n) => n.name).join('; ') : '—'],
      ['Identifiers', identifierLines(cp.identifiers)],
      [
        'Contracts',
        cp.contracts.length
          ? h(
              'ul',
              { class: 'plain-list' },
              cp.contracts
                .slice(0, 4)
                .map((c) =>
                  h('li', null, h('a', { href: `#/contract/${c.contractId}` }, c.title ?? c.externalId), c.roles.length ? ` as ${c.roles.join(', ')}` : ''),
                ),
              cp.contracts.length > 4 ? h('li', { class: 'muted' }, `and ${cp.contracts.length - 4} more`) : null,
            )
          : 'none',
      ],
      ['Mentions', String(cp.mentionCount)],
    ]),
  );
}
