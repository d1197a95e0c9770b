// The review queue: one pair at a time, side by side, the score with each feature's contribution as bars,
// "same" / "different" with keyboard shortcuts, a note, the next pair at once, and a counter of what is left.
import { api } from '../api.js';
import { h, pageTitle, plural, replace } from '../dom.js';
import { errorBox, toast } from '../ui.js';
import { counterpartySide, featureBars, mentionSide } from './review-sides.js';

// Our shortcuts: S same, D different, K skip (keep for later), N note; Esc leaves the note.
export const SHORTCUTS = { same: 's', different: 'd', notAParty: 'p', skip: 'k', note: 'n' };
const PAGE = 20;

const KIND_WORDS = {
  mention_link: 'Does this mention name this counterparty?',
  duplicate: 'Are these two counterparties the same company or person?',
  affiliate: 'Are these two counterparties affiliated?',
};

export async function render(main, { session }) {
  const canDecide = session.can('decide_reviews');
  const queue = [];
  const skipped = new Set();
  const details = new Map(); // counterparty id -> promise of its record
  let open = 0;
  let more = true; // whether the queue holds items not fetched yet
  let current = null;
  let busy = false;

  const counter = h('p', { class: 'counter', id: 'review-counter', role: 'status', 'aria-live': 'polite' });
  const stage = h('div', { class: 'review-stage', id: 'review-stage' });
  const scoreSlot = h('div', { class: 'score-slot' });
  const note = h('textarea', { id: 'review-note', rows: '2', maxlength: '2000', placeholder: 'why (kept with the decision)', disabled: !canDecide });
  const sameButton = h(
    'button',
    { type: 'button', class: 'primary decide', id: 'decide-same', disabled: !canDecide, 'aria-keyshortcuts': 'S' },
    'Same ',
    h('kbd', null, 'S'),
  );
  const differentButton = h(
    'button',
    { type: 'button', class: 'decide', id: 'decide-different', disabled: !canDecide, 'aria-keyshortcuts': 'D' },
    'Different ',
    h('kbd', null, 'D'),
  );
  // A mention that names no party at all (a place, a document word, a signer) is answered as such, not as
  // "different": that answer is kept out of what the weights learn from.
  const notPartyButton = h(
    'button',
    { type: 'button', class: 'decide', id: 'decide-not-a-party', disabled: !canDecide, 'aria-keyshortcuts': 'P' },
    'Not a party ',
    h('kbd', null, 'P'),
  );
  const skipButton = h('button', { type: 'button', id: 'decide-skip', 'aria-keyshortcuts': 'K' }, 'Skip ', h('kbd', null, 'K'));
  const wholeGroup = h('input', { type: 'checkbox', id: 'review-whole-group', disabled: !canDecide });
  const groupRow = h('p', { class: 'group-row', hidden: true }, wholeGroup, h('label', { for: 'review-whole-group', id: 'review-group-label' }, ''));
  const outcome = h('div', { class: 'review-outcome', id: 'review-outcome' });
  const controls = h(
    'div',
    { class: 'review-controls' },
    h('label', { for: 'review-note' }, 'Note ', h('kbd', null, 'N')),
    note,
    groupRow,
    h('div', { class: 'decide-row' }, sameButton, differentButton, notPartyButton, skipButton),
    canDecide ? null : h('p', { class: 'muted', id: 'review-readonly' }, `Your key (${session.me.scope}) may look at the queue; deciding needs an admin key.`),
    h('p', { class: 'hint keys-hint' }, 'Keys: S same · D different · P not a party (a mention only) · K skip · N write a note · Esc leave the note.'),
  );

  const record = (id) => {
    if (id === null || id === undefined) return Promise.resolve(null);
    if (!details.has(id))
      details.set(
        id,
        api(`/v1/counterparties/${id}`).then(
          (r) => r.data,
          () => null,
        ),
      );
    return details.get(id);
  };

  // The queue's size when the answer does not carry it: page through the ids (500 a page).
  async function countOpen() {
    let n = 0;
    let after = null;
    do {
      const { data } = await api(`/v1/review-items?limit=500${after ? `&cursor=${encodeURIComponent(after)}` : ''}`);
      n += data.items.length;
      after = data.nextCursor;
    } while (after);
    return n;
  }

  // The queue comes most-worth-deciding first and its order changes as items are decided, so every fetch starts
  // at the top again (a cursor into the old order would skip items) and leaves out what is already here.
  async function fetchMore() {
    const limit = Math.min(500, PAGE + queue.length + skipped.size + 1);
    const { data } = await api(`/v1/review-items?limit=${limit}`);
    more = Boolean(data.nextCursor);
    if (typeof data.open === 'number') open = data.open;
    else open = !more ? data.items.length : await countOpen();
    for (const item of data.items) if (!skipped.has(item.id) && item.id !== current?.id && !queue.some((q) => q.id === item.id)) queue.push(item);
    // Fetch the sides of the next few pairs now, so the next pair shows at once.
    for (const item of queue.slice(0, 3)) {
      record(item.rightCounterpartyId);
      record(item.leftCounterpartyId);
    }
  }

  function showCounter() {
    counter.textContent = open === 0 ? 'Nothing left to review.' : `${plural(open, 'pair')} left to review${skipped.size ? ` (${skipped.size} skipped)` : ''}.`;
  }

  async function showNext() {
    if (queue.length === 0 && more) await fetchMore();
    current = queue.shift() ?? null;
    showCounter();
    if (!current) {
      replace(scoreSlot);
      replace(
        stage,
        h(
          'p',
          { class: 'empty done' },
          skipped.size
            ? 'No more pairs in this pass. Reload the page to see the skipped ones again.'
            : 'The queue is empty: every doubtful pair has been decided.',
        ),
      );
      controls.hidden = true;
      return;
    }
    controls.hidden = false;
    const item = current;
    const [right, left] = await Promise.all([record(item.rightCounterpartyId), record(item.leftCounterpartyId)]);
    if (current !== item) return;
    for (const next of queue.slice(0, 2)) {
      record(next.rightCounterpartyId);
      record(next.leftCounterpartyId);
    }
    replace(
      stage,
      h(
        'h2',
        { class: 'question', id: 'review-question', tabindex: '-1', dataset: { item: String(item.id), kind: item.kind } },
        KIND_WORDS[item.kind] ?? 'Are these the same?',
        h('span', { class: 'muted' }, ` · item ${item.id}`),
      ),
      h(
        'div',
        { class: 'pair' },
        item.kind === 'mention_link' && item.mention ? mentionSide(item) : counterpartySide(left, 'Counterparty', 'side-left'),
        counterpartySide(right, item.kind === 'mention_link' ? 'Best candidate in the register' : 'Counterparty', 'side-right'),
      ),
    );
    replace(scoreSlot, featureBars(item.evidence, item.score));
    notPartyButton.disabled = !canDecide || item.kind !== 'mention_link';
    // Items of one group (the same spelling waiting on the same candidate) can be settled by one decision.
    const size = item.group?.size ?? 1;
    groupRow.hidden = size < 2;
    wholeGroup.checked = false;
    groupRow.querySelector('label').textContent =
      ` Decide all ${size} alike at once (the same spelling of this name, waiting on the same candidate, in ${plural(item.group?.contracts ?? 0, 'contract')})`;
    if (queue.length < 3 && more) fetchMore().catch(() => undefined);
  }

  async function decide(decision) {
    if (!current || busy || !canDecide) return;
    busy = true;
    const item = current;
    const reason = note.value.trim();
    sameButton.disabled = differentButton.disabled = notPartyButton.disabled = true;
    try {
      const scope = wholeGroup.checked && !groupRow.hidden ? 'group' : 'item';
      const { data } = await api(`/v1/review-items/${item.id}/decision`, { method: 'POST', body: { decision, scope, ...(reason ? { reason } : {}) } });
      const settled = new Set((data.settled ?? [data]).map((d) => d.reviewItemId));
      for (let i = queue.length - 1; i >= 0; i--) if (settled.has(queue[i].id)) queue.splice(i, 1);
      open = Math.max(0, open - settled.size);
      note.value = '';
      details.delete(item.rightCounterpartyId);
      details.delete(item.leftCounterpartyId);
      const where = data.counterpartyId ? h('a', { href: `#/counterparty/${data.counterpartyId}`, id: 'decision-result' }, `#${data.counterpartyId}`) : null;
      replace(
        outcome,
        h(
          'p',
          { class: 'ok', dataset: { item: String(item.id), decision } },
          `Item ${item.id}${settled.size > 1 ? ` and ${plural(settled.size - 1, 'item')} like it` : ''}: ${decision.replaceAll('_', ' ')}. `,
          where ? ['The register now shows it under ', where, '.'] : '',
        ),
      );
      toast(`Decided ${decision.replaceAll('_', ' ')} on item ${item.id}.`);
      await showNext();
      stage.querySelector('h2')?.focus();
    } catch (error) {
      replace(outcome, errorBox(error, `Could not record “${decision}”`));
    } finally {
      busy = false;
      sameButton.disabled = differentButton.disabled = !canDecide;
      notPartyButton.disabled = !canDecide || current?.kind !== 'mention_link';
    }
  }

  function skip() {
    if (!current) return;
    skipped.add(current.id);
    replace(outcome, h('p', { class: 'muted' }, `Item ${current.id} skipped for now.`));
    showNext();
  }

  sameButton.addEventListener('click', () => decide('same'));
  differentButton.addEventListener('click', () => decide('different'));
  notPartyButton.addEventListener('click', () => decide('not_a_party'));
  skipButton.addEventListener('click', skip);
  const onKey = (event) => {
    if (!stage.isConnected || event.ctrlKey || event.metaKey || event.altKey) return;
    const target = event.target;
    const typing = target instanceof HTMLTextAreaElement || target instanceof HTMLInputElement || target.isContentEditable;
    if (typing) {
      if (event.key === 'Escape' && target === note) {
        event.preventDefault();
        note.blur();
        stage.querySelector('h2')?.focus();
      }
      return;
    }
    if (document.getElementById('confirm')?.open) return;
    const key = event.key.toLowerCase();
    if (key === SHORTCUTS.same) decide('same');
    else if (key === SHORTCUTS.different) decide('different');
    else if (key === SHORTCUTS.notAParty && current?.kind === 'mention_link') decide('not_a_party');
    else if (key === SHORTCUTS.skip) skip();
    else if (key === SHORTCUTS.note) {
      event.preventDefault();
      note.focus();
    } else return;
  };
  document.addEventListener('keydown', onKey);

  // Wide windows: the score beside the decision, so both fit above the fold with the pair.
  replace(
    main,
    pageTitle('Review queue'),
    counter,
    stage,
    h('div', { class: 'review-lower' }, scoreSlot, h('div', { class: 'decide-column' }, controls, outcome)),
  );
  stage.setAttribute('tabindex', '-1');
  const stop = () => document.removeEventListener('keydown', onKey);
  try {
    await fetchMore();
    await showNext();
  } catch (error) {
    stop();
    throw error;
  }
  main.querySelector('h1').focus();
  return stop;
}
