// Shared pieces of the page: the error banner, the status toast, the confirmation dialog, error boxes.
import { h, replace } from './dom.js';
import { plainWords } from './api.js';

/** An error as a box: plain words, the API's detail, and the problem's code. */
export function errorBox(error, what) {
  const words = plainWords(error);
  return h(
    'div',
    { class: 'error-box', role: 'alert', dataset: { code: words.code } },
    h('strong', null, what ? `${what}: ` : '', words.lead),
    words.detail ? h('span', { class: 'error-detail' }, ` ${words.detail}`) : null,
    h('span', { class: 'error-code' }, ` (code ${words.code}${words.status ? `, HTTP ${words.status}` : ''})`),
  );
}

/** A banner above the page; `keep` keeps it through the next navigation (e.g. the one it caused). */
export function showNotice(error, what, { keep = false } = {}) {
  const notice = document.getElementById('notice');
  if (keep) notice.dataset.keep = '1';
  replace(notice, errorBox(error, what), h('button', { type: 'button', class: 'link-button', onclick: hideNotice }, 'Dismiss'));
  notice.hidden = false;
}

export function hideNotice({ unlessKept = false } = {}) {
  const notice = document.getElementById('notice');
  if (unlessKept && notice.dataset.keep) {
    delete notice.dataset.keep;
    return;
  }
  delete notice.dataset.keep;
  notice.hidden = true;
  replace(notice);
}

let toastTimer;
export function toast(...content) {
  const element = document.getElementById('toast');
  replace(element, h('div', { class: 'toast-body' }, ...content));
  element.classList.add('shown');
  clearTimeout(toastTimer);
  toastTimer = setTimeout(() => element.classList.remove('shown'), 6000);
}

/**
 * A modal confirmation. `body` says exactly what will change; `reason` asks for the reason the history keeps.
 * `onConfirm(reason)` runs the change; its error shows inside the dialog. Resolves true once confirmed and done.
 */
export function confirmChange({ title, body, confirmLabel, reasonLabel = 'Reason (kept in the history)', reasonRequired = true, danger = false, onConfirm }) {
  const dialog = document.getElementById('confirm');
  return new Promise((resolve) => {
    const reason = h('textarea', { id: 'confirm-reason', rows: '2', maxlength: '2000', required: reasonRequired ? true : null });
    const problem = h('div', { class: 'dialog-problem' });
    const ok = h('button', { type: 'submit', class: danger ? 'danger' : 'primary', id: 'confirm-ok' }, confirmLabel);
    const cancel = h('button', { type: 'button', id: 'confirm-cancel', onclick: () => dialog.close('cancel') }, 'Cancel');
    const form = h(
      'form',
      { method: 'dialog', class: 'dialog-form', novalidate: true },
      h('h2', { id: 'confirm-title' }, title),
      h('div', { class: 'dialog-body' }, body),
      h('label', { for: 'confirm-reason' }, reasonLabel),
      reason,
      problem,
      h('div', { class: 'dialog-actions' }, cancel, ok),
    );
    let done = false;
    form.addEventListener('submit', async (event) => {
      event.preventDefault();
      if (reasonRequired && reason.value.trim() === '') {
        replace(problem, h('p', { class: 'field-problem' }, 'Write a reason: the history keeps it beside the change.'));
        reason.focus();
        return;
      }
      ok.disabled = true;
      ok.textContent = 'Working…';
      try {
        await onConfirm(reason.value.trim());
        done = true;
        dialog.close('done');
      } catch (error) {
        replace(problem, errorBox(error));
        ok.disabled = false;
        ok.textContent = confirmLabel;
      }
    });
    replace(dialog, form);
    dialog.addEventListener('close', () => resolve(done), { once: true });
    dialog.showModal();
    reason.focus();
  });
}

/** A section with a heading, used by every page. */
export function section(title, ...children) {
  return h('section', { class: 'panel' }, h('h2', null, title), ...children);
}

/** The same with an extra class (for placing it in a page's grid). */
export function sectionWith(cls, title, ...children) {
  const element = section(title, ...children);
  element.classList.add(cls);
  return element;
}

/**
 * A table with one header row: `columns` are the header cells' contents (text or an element; a null one is left
 * out), `rows` the body's rows, `attrs` extra attributes of the table (an id).
 */
export function dataTable(columns, rows, attrs = {}) {
  const head = columns.filter((c) => c !== null && c !== undefined).map((c) => h('th', { scope: 'col' }, c));
  return h('table', { class: 'table', ...attrs }, h('thead', null, h('tr', null, head)), h('tbody', null, rows));
}

/** A key/value list. */
export function facts(pairs) {
  return h(
    'dl',
    { class: 'facts' },
    pairs.filter(([, v]) => v !== undefined).flatMap(([k, v]) => [h('dt', null, k), h('dd', null, v ?? '—')]),
  );
}
