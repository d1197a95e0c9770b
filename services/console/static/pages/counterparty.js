// A counterparty: canonical name, typed names with where each was seen, identifiers, jurisdiction, contracts
// with roles, mentions, and the history as a timeline with undo; merge and split with a confirmation.
import { api } from '../api.js';
import { debounce, h, highlighted, pageTitle, plural, replace, when, num } from '../dom.js';
import { confirmChange, errorBox, facts, section, sectionWith, toast } from '../ui.js';
import { evidence, NOT_UNDOABLE, whatHappened } from '../history-words.js';
import { jurisdictionBadge, legalFormBadge } from './search.js';

/** Changes shown at a time in the history; older and newer pages replace the one shown. */
export const HISTORY_PAGE = 10;

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

function contractLink(contractId, label) {
  return contractId ? h('a', { href: `#/contract/${contractId}` }, label ?? `contract ${contractId}`) : null;
}

function namesTable(cp) {
  return h(
    'table',
    { class: 'table' },
    h(
      'thead',
      null,
      h(
        'tr',
        null,
        h('th', { scope: 'col' }, 'Name'),
        h('th', { scope: 'col' }, 'Kind'),
        h('th', { scope: 'col' }, 'Legal form'),
        h('th', { scope: 'col' }, 'Where seen'),
      ),
    ),
    h(
      'tbody',
      null,
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
    ),
  );
}

function identifiersList(cp) {
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

function relationsList(cp) {
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

function contractsTable(cp) {
  if (cp.contracts.length === 0) return h('p', { class: 'empty' }, 'No contracts.');
  return h(
    'table',
    { class: 'table' },
    h('thead', null, h('tr', null, h('th', { scope: 'col' }, 'Contract'), h('th', { scope: 'col' }, 'Reference'), h('th', { scope: 'col' }, 'Role'))),
    h(
      'tbody',
      null,
      cp.contracts.map((c) =>
        h(
          'tr',
          null,
          h('td', null, contractLink(c.contractId, c.title ?? '(untitled)')),
          h('td', null, h('code', null, c.externalId), h('span', { class: 'muted' }, ` ${c.source}`)),
          h('td', null, c.roles.length ? c.roles.join(', ') : '—'),
        ),
      ),
    ),
  );
}

export async function render(main, { params, session, navigate }) {
  const requested = Number(params[0]);
  const [{ data: cp, etag }, mentions, historyPage] = await Promise.all([
    api(`/v1/counterparties/${requested}`),
    api(`/v1/counterparties/${requested}/mentions?limit=200`).then((r) => r.data),
    api(`/v1/counterparties/${requested}/history?limit=${HISTORY_PAGE}`).then((r) => r.data),
  ]);
  if (cp.id !== requested) history.replaceState(null, '', `#/counterparty/${cp.id}`);
  const reload = () => navigate(`#/counterparty/${cp.id}`);

  const canMerge = session.can('merge');
  const canSplit = session.can('split');
  const canUndo = session.can('undo');

  // ---- mentions, with checkboxes for a split
  const chosen = new Set();
  const splitButton = h('button', { type: 'button', id: 'split-button', disabled: true }, 'Split chosen mentions…');
  const updateSplit = () => {
    splitButton.disabled = chosen.size === 0;
    splitButton.textContent = chosen.size === 0 ? 'Split chosen mentions…' : `Split ${plural(chosen.size, 'mention')} into a new counterparty…`;
  };
  const mentionRows = mentions.items.map((m) => {
    const box = canSplit
      ? h('input', {
          type: 'checkbox',
          'aria-label': `choose mention ${m.id}: ${m.text}`,
          dataset: { mention: String(m.id) },
          onchange: (e) => (e.target.checked ? chosen.add(m.id) : chosen.delete(m.id), updateSplit()),
        })
      : null;
    return h(
      'tr',
      null,
      canSplit ? h('td', { class: 'check' }, box) : null,
      h('td', null, m.text),
      h('td', null, m.legalForm ? h('abbr', { title: `family ${m.legalForm.family}` }, m.legalForm.text) : '—'),
      h('td', null, m.contractId ? contractLink(m.contractId, m.contract ? m.contract.externalId : undefined) : '—'),
      h('td', null, m.role ?? '—'),
      h('td', null, m.status, m.confirmedBy ? h('span', { class: 'muted' }, ` · ${m.confirmedBy}`) : ''),
      h('td', { class: 'num' }, scoreWords(m.score)),
      h('td', { class: 'muted' }, m.source),
    );
  });
  const mentionsTable = h(
    'div',
    { class: 'table-wrap' },
    h(
      'table',
      { class: 'table', id: 'mentions' },
      h(
        'thead',
        null,
        h(
          'tr',
          null,
          canSplit ? h('th', { scope: 'col' }, h('span', { class: 'visually-hidden' }, 'Choose')) : null,
          h('th', { scope: 'col' }, 'As written'),
          h('th', { scope: 'col' }, 'Legal form'),
          h('th', { scope: 'col' }, 'Contract'),
          h('th', { scope: 'col' }, 'Role'),
          h('th', { scope: 'col' }, 'Status'),
          h('th', { scope: 'col' }, 'Score'),
          h('th', { scope: 'col' }, 'Source'),
        ),
      ),
      h('tbody', null, mentionRows),
    ),
  );
  splitButton.addEventListener('click', async () => {
    const moving = mentions.items.filter((m) => chosen.has(m.id));
    const ok = await confirmChange({
      title: `Split ${plural(moving.length, 'mention')} out of #${cp.id}`,
      body: [
        h('p', null, `These ${plural(moving.length, 'mention')} leave #${cp.id} “${cp.canonicalName}” and go to a new counterparty:`),
        h(
          'ul',
          { class: 'plain-list change-list' },
          moving.map((m) => h('li', null, `“${m.text}”`, m.contract ? ` (contract ${m.contract.externalId}${m.role ? `, ${m.role}` : ''})` : '')),
        ),
        h(
          'p',
          null,
          `#${cp.id} keeps its other ${plural(mentions.items.length - moving.length, 'mention')}. The split is recorded in the history and can be undone there.`,
        ),
      ],
      confirmLabel: 'Split',
      onConfirm: async (reason) => {
        const { data } = await api(`/v1/counterparties/${cp.id}/split`, { method: 'POST', body: { mentionIds: moving.map((m) => m.id), reason } });
        toast(
          `Split done: ${plural(data.movedMentionIds.length, 'mention')} moved to `,
          h('a', { href: `#/counterparty/${data.targetId}` }, `#${data.targetId}`),
          '.',
        );
      },
    });
    if (ok) reload();
  });

  // ---- merge: choose the other counterparty, then confirm
  const mergePanel = canMerge ? mergeChooser(cp, etag, navigate) : null;

  // ---- history timeline
  const undone = new Set(historyPage.items.filter((e) => e.undoesEventId).map((e) => e.undoesEventId));
  const eventItem = (event) => {
    const undoable = canUndo && !NOT_UNDOABLE.has(event.type) && !undone.has(event.id);
    return h(
      'li',
      { class: `event event-${event.type}${undone.has(event.id) ? ' is-undone' : ''}`, dataset: { event: String(event.id), type: event.type } },
      h(
        'div',
        { class: 'event-head' },
        h('span', { class: 'event-what' }, whatHappened(event)),
        undone.has(event.id) ? h('span', { class: 'tag tag-undone' }, 'undone') : null,
      ),
      h('div', { class: 'event-meta' }, when(event.at), ' · by ', h('strong', null, event.actor), ` · change ${event.id}`),
      event.reason ? h('div', { class: 'event-why' }, 'Why: ', event.reason) : null,
      evidence(event),
      undoable ? h('button', { type: 'button', class: 'small', dataset: { undo: String(event.id) }, onclick: () => undo(event) }, 'Undo') : null,
    );
  };
  const timeline = h('ol', { class: 'timeline', id: 'history' }, historyPage.items.map(eventItem));
  // A page of changes at a time, newest first: the cursors of the pages seen so far lead back to newer ones.
  const pageCursors = [null];
  let pageIndex = 0;
  let nextCursor = historyPage.nextCursor;
  let shownCount = historyPage.items.length;
  const pageNote = h('span', { class: 'muted', id: 'history-page' });
  const newer = h('button', { type: 'button', class: 'small', id: 'history-newer' }, 'Newer changes');
  const older = h('button', { type: 'button', class: 'small', id: 'history-older' }, 'Older changes');
  const pager = h('p', { class: 'toolbar history-pager' }, newer, ' ', older, ' ', pageNote);
  const showPager = () => {
    const first = pageIndex * HISTORY_PAGE + 1;
    newer.hidden = pageIndex === 0;
    older.hidden = !nextCursor;
    pager.hidden = pageIndex === 0 && !nextCursor;
    pageNote.textContent = shownCount > 0 ? `changes ${first} to ${first + shownCount - 1}, newest first` : '';
  };
  showPager();
  const turnTo = async (index) => {
    newer.disabled = true;
    older.disabled = true;
    try {
      const cursor = pageCursors[index];
      const { data } = await api(`/v1/counterparties/${cp.id}/history?limit=${HISTORY_PAGE}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`);
      for (const e of data.items) if (e.undoesEventId) undone.add(e.undoesEventId);
      pageIndex = index;
      pageCursors[index + 1] = data.nextCursor;
      nextCursor = data.nextCursor;
      shownCount = data.items.length;
      replace(timeline, ...data.items.map(eventItem));
      showPager();
      timeline.scrollIntoView?.({ block: 'nearest' });
    } catch (error) {
      pager.after(errorBox(error, 'Could not read that page of changes'));
    } finally {
      newer.disabled = false;
      older.disabled = false;
    }
  };
  pageCursors[1] = nextCursor;
  newer.addEventListener('click', () => turnTo(pageIndex - 1));
  older.addEventListener('click', () => turnTo(pageIndex + 1));
  async function undo(event) {
    const ok = await confirmChange({
      title: `Undo change ${event.id}`,
      body: [
        h('p', null, 'This reverses: ', h('strong', null, whatHappened(event)), ` (by ${event.actor}).`),
        h('p', null, 'The undo is itself recorded in the history. If later changes depend on this one, the register refuses and names them.'),
      ],
      confirmLabel: 'Undo',
      onConfirm: async (reason) => {
        await api(`/v1/history/${event.id}/undo`, { method: 'POST', body: { reason } });
        toast(`Change ${event.id} undone.`);
      },
    });
    if (ok) reload();
  }

  const legalForm = legalFormOf(cp);
  replace(
    main,
    h(
      'div',
      { class: 'cp-head' },
      h('p', { class: 'crumbs' }, h('a', { href: '#/search' }, 'Search'), ' › counterparty'),
      cp.id !== requested ? h('p', { class: 'ok', id: 'merged-notice' }, `Counterparty #${requested} was merged into #${cp.id}; this is #${cp.id}.`) : null,
      pageTitle(cp.canonicalName),
      h(
        'p',
        { class: 'cp-badges' },
        legalFormBadge(legalForm),
        jurisdictionBadge(cp.jurisdiction),
        h('span', { class: 'badge' }, cp.kind),
        h('span', { class: 'badge' }, `#${cp.id}`),
        h('span', { class: 'badge' }, plural(cp.mentionCount, 'mention')),
        h('span', { class: 'badge' }, plural(cp.contracts.length, 'contract')),
      ),
      h(
        'p',
        { class: 'cp-actions' },
        h('a', { class: 'button', href: `#/network/${cp.id}`, id: 'open-network' }, 'Network'),
        canMerge ? null : h('span', { class: 'muted' }, `Your key (${session.me.scope}) may read; merging and splitting need an admin key.`),
      ),
    ),
    h(
      'div',
      { class: 'cp-grid' },
      section('Names', namesTable(cp)),
      sectionWith(
        mergePanel ? 'panel-tall' : 'panel-plain',
        'Identifiers and place',
        facts([
          ['Jurisdiction', cp.jurisdiction ?? 'unknown'],
          ['Kind', cp.kind],
          ['Canonical name set by', cp.nameLockedBy ?? 'the register’s rules'],
          ['Updated', when(cp.updatedAt)],
        ]),
        h('h3', null, 'Identifiers'),
        identifiersList(cp),
        h('h3', null, 'Relations'),
        relationsList(cp),
      ),
      section('Contracts', contractsTable(cp)),
      mergePanel ? section('Merge', mergePanel) : null,
    ),
    section(`Mentions (${mentions.items.length}${mentions.nextCursor ? '+' : ''})`, canSplit ? h('p', { class: 'toolbar' }, splitButton) : null, mentionsTable),
    section('History', historyPage.items.length ? timeline : h('p', { class: 'empty' }, 'No history.'), pager),
  );
  main.querySelector('h1').focus();
}

function mergeChooser(cp, etag, navigate) {
  const box = h('input', { type: 'search', id: 'merge-search', autocomplete: 'off', placeholder: 'name of the other counterparty' });
  const results = h('ul', { class: 'plain-list merge-results', id: 'merge-results' });
  let sequence = 0;
  const find = debounce(async () => {
    const q = box.value.trim();
    const mine = ++sequence;
    if (!q) return replace(results);
    try {
      const { data } = await api(`/v1/counterparties?q=${encodeURIComponent(q)}&limit=8`);
      if (mine !== sequence) return;
      const others = data.items.filter((hit) => hit.id !== cp.id);
      replace(
        results,
        others.length === 0
          ? h('li', { class: 'empty' }, 'No other counterparty found.')
          : others.map((hit) =>
              h(
                'li',
                null,
                h('button', { type: 'button', class: 'small', dataset: { mergeWith: String(hit.id) }, onclick: () => confirmMerge(hit.id) }, 'Merge with'),
                ' ',
                highlighted(hit.matchedName, hit.highlight),
                h('span', { class: 'muted' }, ` #${hit.id} · ${hit.jurisdiction ?? '?'}`),
              ),
            ),
      );
    } catch (error) {
      replace(results, h('li', null, errorBox(error, 'Search failed')));
    }
  }, 200);
  box.addEventListener('input', find);

  async function confirmMerge(otherId) {
    let other;
    let otherEtag;
    try {
      const answer = await api(`/v1/counterparties/${otherId}`);
      other = answer.data;
      otherEtag = answer.etag ?? answer.data.etag;
    } catch (error) {
      replace(results, h('li', null, errorBox(error, 'Could not read the other counterparty')));
      return;
    }
    let survivor = cp;
    let absorbed = other;
    const describe = h('div', { class: 'merge-description' });
    const explain = () =>
      replace(
        describe,
        h(
          'p',
          null,
          h('strong', null, `#${absorbed.id} “${absorbed.canonicalName}”`),
          ` joins `,
          h('strong', null, `#${survivor.id} “${survivor.canonicalName}”`),
          '.',
        ),
        h(
          'ul',
          { class: 'plain-list change-list' },
          h(
            'li',
            null,
            `${plural(absorbed.mentionCount, 'mention')}, ${plural(absorbed.names.length, 'name')}, ${plural(absorbed.identifiers.length, 'identifier')} and ${plural(absorbed.contracts.length, 'contract')} of #${absorbed.id} move to #${survivor.id}.`,
          ),
          h('li', null, `#${survivor.id} then has ${plural(survivor.mentionCount + absorbed.mentionCount, 'mention')}.`),
          h('li', null, `#${absorbed.id} stops being active; reading #${absorbed.id} through the API leads to #${survivor.id}.`),
          h('li', null, 'The merge is recorded in the history and can be undone there.'),
        ),
      );
    const choice = (candidate, checked) =>
      h(
        'label',
        { class: 'radio' },
        h('input', {
          type: 'radio',
          name: 'survivor',
          value: String(candidate.id),
          checked,
          onchange: () => ((survivor = candidate), (absorbed = candidate === cp ? other : cp), explain()),
        }),
        ` keep #${candidate.id} “${candidate.canonicalName}”`,
      );
    explain();
    const ok = await confirmChange({
      title: `Merge #${cp.id} and #${other.id}`,
      body: [h('fieldset', { class: 'survivor' }, h('legend', null, 'Which one stays'), choice(cp, true), choice(other, false)), describe],
      confirmLabel: 'Merge',
      danger: true,
      onConfirm: async (reason) => {
        const { data } = await api('/v1/counterparties/merge', {
          method: 'POST',
          body: {
            items: [
              { id: cp.id, etag },
              { id: other.id, etag: otherEtag },
            ],
            survivorId: survivor.id,
            reason,
          },
        });
        toast(`Merged: #${data.mergedIds.join(', #')} into #${data.survivorId}.`);
        survivor = { id: data.survivorId };
      },
    });
    if (ok) navigate(`#/counterparty/${survivor.id}`);
  }

  return h('div', { class: 'merge-chooser' }, h('label', { for: 'merge-search' }, 'Find the counterparty that is the same company or person'), box, results);
}
