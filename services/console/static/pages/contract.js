// A contract: its parties with roles, their defined terms and where each party went in the register.
import { api } from '../api.js';
import { h, pageTitle, replace, when } from '../dom.js';
import { dataTable, facts, section } from '../ui.js';

// A party's status in words where no counterparty or own entity names it ("not_a_party" is no word for a screen).
const PARTY_STATUS_WORDS = {
  review: 'waiting for review',
  not_a_party: 'not a party',
  unbound_term: 'a defined term no party holds',
  collective_term: 'several parties together',
};
const partyStatus = (status) => PARTY_STATUS_WORDS[status] ?? String(status ?? '—').replaceAll('_', ' ');

export async function render(main, { params }) {
  const { data: c } = await api(`/v1/contracts/${Number(params[0])}`);
  replace(
    main,
    h('p', { class: 'crumbs' }, h('a', { href: '#/search' }, 'Search'), ' › contract'),
    pageTitle(c.title ?? c.externalId),
    facts([
      ['Reference', h('code', null, c.externalId)],
      ['Source', c.source],
      ['Status', String(c.status ?? '—').replaceAll('_', ' ')],
      ['Stored', when(c.createdAt)],
    ]),
    section(
      'Parties',
      dataTable(
        ['As written', 'Role', 'Defined as', 'In the register'],
        c.parties.map((p) =>
          h(
            'tr',
            null,
            h('td', null, p.text),
            h('td', null, p.role ?? '—'),
            h('td', null, p.terms.length ? p.terms.map((t) => `“${t}”`).join(', ') : '—'),
            h(
              'td',
              null,
              p.counterpartyId
                ? h('a', { href: `#/counterparty/${p.counterpartyId}` }, p.canonicalName ?? `#${p.counterpartyId}`)
                : p.ownEntityId
                  ? 'our own entity'
                  : partyStatus(p.status),
            ),
          ),
        ),
      ),
    ),
  );
  main.querySelector('h1').focus();
}
