// The console's shell: sign-in state, navigation by the address's #fragment, and the page modules.
import { api, forgetKey, onUnauthenticated, storedKey } from './api.js';
import { documentTitle, h, pageTitle, replace } from './dom.js';
import { errorBox, hideNotice, showNotice } from './ui.js';
import * as signin from './pages/signin.js';
import * as search from './pages/search.js';
import * as counterparty from './pages/counterparty.js';
import * as network from './pages/network.js';
import * as review from './pages/review.js';
import * as scores from './pages/scores.js';
import * as contract from './pages/contract.js';
import * as importFiles from './pages/import.js';

// What the key allows (GET /v1/me): the pages ask `session.can('merge')` and hide or disable the rest.
export const session = {
  me: null,
  can(action) {
    return Boolean(this.me && this.me.allows.includes(action));
  },
};

const ROUTES = [
  { pattern: /^\/search$/, page: search, section: 'search' },
  { pattern: /^\/counterparty\/(\d+)$/, page: counterparty, section: 'search' },
  { pattern: /^\/network\/(\d+)$/, page: network, section: 'search' },
  { pattern: /^\/contract\/(\d+)$/, page: contract, section: 'search' },
  { pattern: /^\/review$/, page: review, section: 'review' },
  { pattern: /^\/scores$/, page: scores, section: 'scores' },
  { pattern: /^\/import$/, page: importFiles, section: 'import' },
];

let cleanup = null;
// Each navigation renders into a fresh container; a page still loading when the person moves on writes into its
// own detached container and its cleanup runs at once (see route()).
let generation = 0;

function parseHash() {
  const raw = location.hash.replace(/^#/, '') || '/search';
  const [path, query = ''] = raw.split('?');
  return { path, query: new URLSearchParams(query) };
}

export function navigate(hash) {
  if (location.hash === hash) route();
  else location.hash = hash;
}

async function loadMe() {
  const { data } = await api('/v1/me');
  session.me = data;
  showWho();
}

function showWho() {
  const who = document.getElementById('who');
  const nav = document.getElementById('nav');
  if (!session.me) {
    who.hidden = true;
    nav.hidden = true;
    return;
  }
  replace(
    who,
    h('span', { class: 'who-label', title: `key ${session.me.keyId}` }, session.me.label),
    h('span', { class: `scope scope-${session.me.scope}`, title: `may: ${session.me.allows.join(', ')}` }, session.me.scope),
    h('button', { type: 'button', class: 'link-button', id: 'sign-out', onclick: signOut }, 'Sign out'),
  );
  who.hidden = false;
  nav.hidden = false;
}

export function signOut() {
  forgetKey();
  session.me = null;
  showWho();
  location.hash = '#/signin';
}

async function route() {
  if (cleanup) {
    try {
      cleanup();
    } catch {
      /* a page's cleanup never stops navigation */
    }
    cleanup = null;
  }
  hideNotice({ unlessKept: true });
  const main = document.getElementById('main');
  const { path, query } = parseHash();
  if (!storedKey() || path === '/signin') {
    if (storedKey() && path === '/signin') forgetKey();
    session.me = null;
    showWho();
    generation++;
    cleanup = signin.render(main, { query, session, onSignedIn: afterSignIn }) ?? null;
    return;
  }
  if (!session.me) {
    try {
      await loadMe();
    } catch (error) {
      document.title = documentTitle('Could not check your key');
      replace(main, errorBox(error, 'Could not check your key'));
      return;
    }
  }
  const match = ROUTES.map((r) => ({ r, m: r.pattern.exec(path) })).find((x) => x.m);
  for (const link of document.querySelectorAll('#nav a')) {
    if (match && link.dataset.section === match.r.section) link.setAttribute('aria-current', 'page');
    else link.removeAttribute('aria-current');
  }
  if (!match) {
    replace(main, pageTitle('Not here'), h('p', null, 'No page has this address. ', h('a', { href: '#/search' }, 'Go to search')));
    return;
  }
  const mine = ++generation;
  // Each page names itself (pageTitle sets the document title); until then the tab says it is loading.
  document.title = documentTitle('Loading…');
  const view = h('div', { class: 'view' }, h('p', { class: 'loading' }, 'Loading…'));
  replace(main, view);
  try {
    const done = (await match.r.page.render(view, { params: match.m.slice(1), query, session, navigate })) ?? null;
    if (mine === generation) cleanup = done;
    else done?.();
  } catch (error) {
    if (mine === generation) {
      document.title = documentTitle('Could not show this page');
      replace(view, errorBox(error, 'Could not show this page'));
    }
  }
}

async function afterSignIn(me) {
  session.me = me;
  showWho();
  location.hash = '#/search';
}

onUnauthenticated((problem) => {
  forgetKey();
  session.me = null;
  showWho();
  location.hash = '#/signin';
  showNotice(problem, 'Signed out', { keep: true });
});

window.addEventListener('hashchange', route);
route();
