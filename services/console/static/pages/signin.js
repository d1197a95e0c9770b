// Sign in with an API key: the key is checked with GET /v1/me and kept in sessionStorage (this tab only).
import { api, storeKey } from '../api.js';
import { h, replace, pageTitle } from '../dom.js';
import { errorBox } from '../ui.js';

const ALLOW_WORDS = {
  read: 'search and read counterparties, contracts, history, the review queue and scores; download exports',
  ingest: 'load mentions',
  resolve: 'resolve mentions',
  post_contracts: 'post contracts',
  merge: 'merge',
  split: 'split',
  undo: 'undo changes',
  decide_reviews: 'decide review items',
  edit_counterparties: 'edit counterparties',
  manage_own_entities: 'manage our own entities',
  manage_keys: 'manage API keys',
};

export function describeAllows(allows) {
  return allows.map((a) => ALLOW_WORDS[a] ?? a).join('; ');
}

export function render(main, { onSignedIn }) {
  const key = h('input', {
    id: 'api-key',
    name: 'api-key',
    type: 'password',
    autocomplete: 'off',
    spellcheck: 'false',
    required: true,
    placeholder: 'your API key',
  });
  const problem = h('div', { class: 'form-problem' });
  const button = h('button', { type: 'submit', class: 'primary', id: 'sign-in' }, 'Sign in');
  const form = h(
    'form',
    { class: 'signin', novalidate: true },
    h('label', { for: 'api-key' }, 'API key'),
    key,
    h(
      'p',
      { class: 'hint' },
      'Kept in this browser tab only and forgotten when it closes. An administrator makes keys with ',
      h('code', null, 'cpreg keys create'),
      '.',
    ),
    problem,
    button,
  );
  form.addEventListener('submit', async (event) => {
    event.preventDefault();
    const value = key.value.trim();
    if (!value) {
      replace(problem, h('p', { class: 'field-problem' }, 'Paste your API key first.'));
      key.focus();
      return;
    }
    button.disabled = true;
    try {
      const { data } = await api('/v1/me', { key: value });
      storeKey(value);
      onSignedIn(data);
    } catch (error) {
      replace(problem, errorBox(error, 'Could not sign in'));
      key.focus();
    } finally {
      button.disabled = false;
    }
  });
  replace(
    main,
    h(
      'div',
      { class: 'signin-page' },
      pageTitle('Sign in to the counterparty register'),
      h('p', { class: 'lead' }, 'Search counterparties, work the review queue, merge and split, and see who contracts with whom.'),
      form,
    ),
  );
  key.focus();
}
