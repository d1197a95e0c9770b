// Search: one box, results as you type (debounced), ranked by the API, the matched name highlighted.
import { api } from '../api.js';
import { debounce, h, highlighted, num, pageTitle, replace } from '../dom.js';
import { errorBox } from '../ui.js';

const DEBOUNCE_MS = 200;

export function legalFormBadge(legalForm) {
  return legalForm
    ? h('span', { class: 'badge badge-form', title: 'legal form' }, legalForm.toUpperCase())
    : h('span', { class: 'badge badge-none', title: 'legal form' }, 'no legal form');
}

export function jurisdictionBadge(jurisdiction) {
  return h('span', { class: 'badge badge-place', title: 'jurisdiction' }, jurisdiction ?? 'jurisdiction unknown');
}

function resultItem(hit) {
  const other = hit.matchedName !== hit.canonicalName;
  return h(
    'li',
    { class: 'result' },
    h(
      'a',
      { href: `#/counterparty/${hit.id}`, class: 'result-link', dataset: { id: String(hit.id) } },
      h('span', { class: 'result-name' }, highlighted(hit.matchedName, hit.highlight)),
      other ? h('span', { class: 'result-canonical' }, `registered as ${hit.canonicalName}`) : null,
      h(
        'span',
        { class: 'result-meta' },
        legalFormBadge(hit.legalForm),
        jurisdictionBadge(hit.jurisdiction),
        h('span', { class: 'result-id' }, `#${hit.id}`),
        hit.score !== null ? h('span', { class: 'result-score', title: 'match score (weight of evidence, in bits)' }, `score ${num(hit.score, 1)}`) : null,
      ),
    ),
  );
}

export function render(main, { query }) {
  const box = h('input', {
    id: 'search-box',
    type: 'search',
    autocomplete: 'off',
    spellcheck: 'false',
    value: query.get('q') ?? '',
    'aria-controls': 'results',
    'aria-describedby': 'search-hint',
    placeholder: 'a company name, or part of one',
  });
  const status = h('p', { class: 'search-status', role: 'status', 'aria-live': 'polite' });
  const results = h('ol', { id: 'results', class: 'results' });
  let sequence = 0;
  let controller;

  async function run() {
    const q = box.value.trim();
    const mine = ++sequence;
    controller?.abort();
    controller = new AbortController();
    history.replaceState(null, '', q ? `#/search?q=${encodeURIComponent(q)}` : '#/search');
    status.textContent = 'Searching…';
    try {
      const path = q ? `/v1/counterparties?q=${encodeURIComponent(q)}&limit=25` : '/v1/counterparties?limit=25';
      const { data } = await api(path, { signal: controller.signal });
      if (mine !== sequence) return;
      replace(
        results,
        data.items.map((hit) => resultItem(hit)),
      );
      status.textContent = q
        ? data.items.length === 0
          ? `Nothing found for “${q}”.`
          : `${data.items.length}${data.nextCursor ? '+' : ''} found for “${q}”, best first.`
        : 'Type to search. Below: the first counterparties in the register, in the order they were created.';
    } catch (error) {
      if (error && error.name === 'AbortError') return;
      if (mine !== sequence) return;
      replace(results);
      replace(status, errorBox(error, 'Search failed'));
    }
  }

  const later = debounce(run, DEBOUNCE_MS);
  box.addEventListener('input', later);
  box.addEventListener('keydown', (event) => {
    if (event.key === 'ArrowDown') {
      const first = results.querySelector('a');
      if (first) {
        event.preventDefault();
        first.focus();
      }
    }
  });
  results.addEventListener('keydown', (event) => {
    const links = [...results.querySelectorAll('a')];
    const at = links.indexOf(document.activeElement);
    if (at < 0) return;
    if (event.key === 'ArrowDown' && at < links.length - 1) {
      event.preventDefault();
      links[at + 1].focus();
    } else if (event.key === 'ArrowUp') {
      event.preventDefault();
      (at === 0 ? box : links[at - 1]).focus();
    }
  });

  replace(
    main,
    pageTitle('Find a counterparty'),
    h('div', { class: 'search-form', role: 'search' }, h('label', { for: 'search-box', class: 'visually-hidden' }, 'Counterparty name'), box),
    h('p', { id: 'search-hint', class: 'hint' }, 'Results appear as you type, ranked as the register matches names. ↓ moves into the results.'),
    status,
    results,
  );
  box.focus();
  run();
}
