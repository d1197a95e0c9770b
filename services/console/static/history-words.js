// History events in plain words: who, when, what, why, and the evidence the register kept.
import { h, num, plural } from './dom.js';

const cpLink = (id) => h('a', { href: `#/counterparty/${id}` }, `#${id}`);
const list = (ids) => (ids ?? []).flatMap((id, i) => (i === 0 ? [cpLink(id)] : [', ', cpLink(id)]));

/** What happened, as a short sentence (with links to the counterparties it names). */
export function whatHappened(event) {
  const d = event.details ?? {};
  switch (event.type) {
    case 'created':
      return d.createdCounterpartyId
        ? ['Created counterparty ', cpLink(d.createdCounterpartyId), d.mentionId ? ` from mention ${d.mentionId}` : '']
        : ['Created'];
    case 'linked':
      return [
        `Mention ${d.mentionId ?? event.mentionIds?.[0] ?? ''} linked`,
        d.counterpartyId ? [' to ', cpLink(d.counterpartyId)] : '',
        d.score !== null && d.score !== undefined ? (Math.abs(d.score) >= 1e5 ? ' (by a strong identifier)' : ` (score ${num(d.score, 1)})`) : '',
      ];
    case 'unlinked':
      return [`Mention ${d.mentionId ?? event.mentionIds?.[0] ?? ''} unlinked`];
    case 'merged':
      return ['Merged ', list(d.mergedIds), ' into ', d.survivorId ? cpLink(d.survivorId) : '?'];
    case 'split':
      return [
        `Split: ${plural((d.mentionIds ?? event.mentionIds ?? []).length, 'mention')} moved from `,
        d.sourceId ? cpLink(d.sourceId) : '?',
        ' to ',
        d.targetId ? cpLink(d.targetId) : '?',
      ];
    case 'renamed':
      return [`Renamed from “${d.from ?? '?'}” to “${d.to ?? '?'}”`];
    case 'jurisdiction_changed':
      return [`Jurisdiction changed from ${d.from ?? 'none'} to ${d.to ?? 'none'}`];
    case 'review_decided':
      return [`Review item ${d.reviewItemId ?? ''} decided: ${d.decision ?? ''}`];
    case 'undone':
      return [`Undid change ${event.undoesEventId ?? d.undoes ?? ''}${d.undoneType ? ` (${String(d.undoneType).replaceAll('_', ' ')})` : ''}`];
    default:
      return [event.type.replaceAll('_', ' ').replace(/^./, (c) => c.toUpperCase())];
  }
}

function shortValue(value) {
  if (value === null || value === undefined) return '—';
  if (typeof value === 'number') return num(value, 3);
  if (typeof value === 'string') return value;
  const text = JSON.stringify(value);
  return text.length > 160 ? `${text.slice(0, 157)}…` : text;
}

/** A detail's key in words: "survivorId" and "merged_ids" read "survivor id" and "merged ids". */
export function keyWords(key) {
  return key
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replaceAll('_', ' ')
    .toLowerCase();
}

/** The event's details as a small key/value list (the evidence of the change). */
export function evidence(event) {
  const entries = Object.entries(event.details ?? {});
  if (entries.length === 0) return null;
  return h(
    'details',
    { class: 'evidence' },
    h('summary', null, 'Evidence'),
    h(
      'dl',
      { class: 'facts small' },
      entries.flatMap(([k, v]) => [h('dt', null, keyWords(k)), h('dd', null, shortValue(v))]),
    ),
  );
}

export const NOT_UNDOABLE = new Set(['undone', 'forgotten']);
