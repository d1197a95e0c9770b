// A counterparty: canonical name, typed names with where each was seen, identifiers, jurisdiction, contracts
// with roles, mentions, and the history as a timeline with undo; merge and split with a confirmation.
import { api } from '../api.js';
import { h, pageTitle, plural, replace, when } from '../dom.js';
import { dataTable, confirmChange, errorBox, facts, section, sectionWith, toast } from '../ui.js';
import { evidence, NOT_UNDOABLE, whatHappened } from '../history-words.js';
import { jurisdictionBadge, legalFormBadge } from './search.js';
import { contractLink, contractsTable, identifiersList, legalFormOf, namesTable, relationsList, scoreWords } from './counterparty-sections.js';
import { mergeChooser } from './merge-chooser.js';

/** Changes shown at a time in the history; older and newer pages replace the one shown. */
export const HISTORY_PAGE = 10;

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
    dataTable(
      [canSplit ? h('span', { class: 'visually-hidden' }, 'Choose') : null, 'As written', 'Legal form', 'Contract', 'Role', 'Status', 'Score', 'Source'],
      mentionRows,
      { id: 'mentions' },
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
