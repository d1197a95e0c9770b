// The sections of the counterparty page built from its record alone: names, identifiers, relations, contracts,
// and the words for its legal form and scores (pages/counterparty.js puts them together).
import { h, num, plural } from '../dom.js';
import { dataTable } from '../ui.js';

const NAME_KIND_WORDS = { legal: 'legal name', trade: 'trade name', former: 'former name', also_known_as: 'also known as', observed: 'as written' };

export function legalFormOf(cp) {
  const canonical = cp.names.find((n) => n.name === cp.canonicalName && n.legalForm);
  return canonical?.legalForm ?? cp.names.find((n) => n.kind === 'legal' && n.legalForm)?.legalForm ?? null;
}

/** Scores beyond ±100,000 are the register's way of saying a strong identifier decided. */
export function scoreWords(score) {
  if (score === null || score === undefined) return '—';
  if (Math.abs(score) >= 1e5) return score > 0 ? 'identifier' : 'identifier conflict';
  return num(score, 1);
}

export function contractLink(contractId, label) {
  return contractId ? h('a', { href: `#/contract/${contractId}` }, label ?? `contract ${contractId}`) : null;
}

export function namesTable(cp) {
  return dataTable(
    ['Name', 'Kind', 'Legal form', 'Where seen'],
    cp.names.map((n) =>
      h(
        'tr',
        null,
        h(
          'td',
          { class: n.name === cp.canonicalName ? 'canonical' : null },
          n.name,
          n.name === cp.canonicalName ? h('span', { class: 'tag' }, 'canonical') : null,
        ),
        h('td', null, NAME_KIND_WORDS[n.kind] ?? n.kind),
        h('td', null, n.legalForm ? n.legalForm.toUpperCase() : '—'),
        h(
          'td',
          { class: 'where' },
          `${plural(n.seenCount, 'time')}`,
          n.source ? ` · ${n.source}` : '',
          n.contractId ? [' · ', contractLink(n.contractId, cp.contracts.find((c) => c.contractId === n.contractId)?.externalId)] : '',
          n.mentionId ? ` · mention ${n.mentionId}` : '',
          n.confirmedBy ? ` · confirmed by ${n.confirmedBy}` : '',
        ),
      ),
    ),
  );
}

export function identifiersList(cp) {
  if (cp.identifiers.length === 0) return h('p', { class: 'empty' }, 'No identifiers recorded.');
  return h(
    'ul',
    { class: 'plain-list' },
    cp.identifiers.map((x) =>
      h(
        'li',
        null,
        h('span', { class: 'scheme' }, x.scheme),
        ' ',
        h('code', null, x.value),
        x.strong ? h('span', { class: 'tag tag-strong', title: 'a strong identifier decides a match by itself' }, 'strong') : null,
        h('span', { class: 'muted' }, x.source ? ` from ${x.source}` : '', x.confirmedBy ? ` · ${x.confirmedBy}` : ''),
      ),
    ),
  );
}

export function relationsList(cp) {
  if (cp.relations.length === 0) return h('p', { class: 'empty' }, 'No relations recorded.');
  return h(
    'ul',
    { class: 'plain-list' },
    cp.relations.map((r) => {
      const other = r.fromCounterpartyId === cp.id ? r.toCounterpartyId : r.fromCounterpartyId;
      const words = r.fromCounterpartyId === cp.id ? r.type.replaceAll('_', ' ') : `${r.type.replaceAll('_', ' ')} (from)`;
      return h(
        'li',
        null,
        `${words} `,
        h('a', { href: `#/counterparty/${other}` }, `#${other}`),
        r.since ? ` since ${r.since}` : '',
        h('span', { class: 'muted' }, ` · ${r.origin}, ${r.status}`),
      );
    }),
  );
}

export function contractsTable(cp) {
  if (cp.contracts.length === 0) return h('p', { class: 'empty' }, 'No contracts.');
  return dataTable(
    ['Contract', 'Reference', 'Role'],
    cp.contracts.map((c) =>
      h(
        'tr',
        null,
        h('td', null, contractLink(c.contractId, c.title ?? '(untitled)')),
        h('td', null, h('code', null, c.externalId), h('span', { class: 'muted' }, ` ${c.source}`)),
        h('td', null, c.roles.length ? c.roles.join(', ') : '—'),
      ),
    ),
  );
}
