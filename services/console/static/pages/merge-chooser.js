// The counterparty page's merge panel: find the other counterparty by name, then merge it into this one after a
// confirmation (pages/counterparty.js shows it).
import { api } from '../api.js';
import { debounce, h, highlighted, plural, replace } from '../dom.js';
import { confirmChange, errorBox, toast } from '../ui.js';

export function mergeChooser(cp, etag, navigate) {
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
