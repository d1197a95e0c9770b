// Contract files in: drop a zip or PDF, Word and text files, follow the import job, then see the contracts with their
// parties (each linked to its counterparty or to the review queue) and the files not imported with their reasons.
import { api, apiForm } from '../api.js';
import { h, pageTitle, plural, replace } from '../dom.js';
import { dataTable, errorBox, section } from '../ui.js';

// The longest source the register takes (MAX_ID_LENGTH, resolvers/vocabulary.ts). The console is plain JavaScript
// served as it is and cannot import the TypeScript constant: tests/services/console/console-copies.test.ts checks
// that this copy equals it.
const MAX_ID_LENGTH = 300;

// The reasons a file is not imported (resolvers/files/reject-reasons.ts), in words for a person.
const REASON_WORDS = {
  unreadable: 'could not be read or is damaged',
  encrypted_pdf: 'PDF locked with a password',
  no_text_layer: 'PDF without a text layer (a scan?): no OCR is attempted',
  no_text: 'holds no text',
  unsupported_type: 'not a PDF, Word (.docx) or text file',
  file_too_large: 'file over the size limit',
  text_too_large: 'text over the 1 MB limit of a contract',
  no_parties: 'no parties found',
  unsafe_path: 'path outside the archive: not read',
  symlink: 'a symbolic link: not followed',
  encrypted_entry: 'encrypted in the archive: not read',
  compression_ratio: 'expands too much (a zip bomb?): not read',
  archive_refused: 'archive over a limit: nothing in it was read',
  nested_too_deep: 'an archive too deep inside archives',
  duplicate_path: 'the same path twice in the archive',
  contract_refused: 'refused by the register',
  path_too_long: 'path too long for a contract reference',
};
const reasonWords = (code) => REASON_WORDS[code] ?? String(code).replaceAll('_', ' ');
const STAGE_WORDS = {
  staging: 'Reading the files and extracting their text',
  planning: 'Planning',
  storing: 'Storing the contracts and resolving their parties',
  finished: 'Finished',
};
const POLL_MS = 700;

function partyCell(p) {
  const who = p.counterpartyId
    ? h('a', { href: `#/counterparty/${p.counterpartyId}` }, p.canonicalName ?? `#${p.counterpartyId}`)
    : p.ownEntityId
      ? 'our own entity'
      : p.status === 'review'
        ? h('a', { href: '#/review' }, 'waiting for review')
        : String(p.status ?? '—').replaceAll('_', ' ');
  return h('li', null, h('span', { class: 'as-written' }, p.name), p.role ? ` (${p.role})` : '', ' → ', who);
}

function contractsTable(contracts) {
  return h(
    'div',
    { class: 'table-wrap' },
    dataTable(
      ['File', 'Parties, as written → in the register'],
      contracts.map((c) =>
        h(
          'tr',
          null,
          h(
            'td',
            { class: 'file-path' },
            h('a', { href: `#/contract/${c.contractId}` }, c.path),
            c.change === 'changed' ? h('span', { class: 'hint' }, ' (new version)') : null,
          ),
          h('td', null, h('ul', { class: 'party-list' }, c.parties.map(partyCell))),
        ),
      ),
      { id: 'import-contracts' },
    ),
  );
}

function rejectsTable(rejected) {
  return h(
    'div',
    { class: 'table-wrap' },
    dataTable(
      ['File', 'Why not imported'],
      rejected.map((r) =>
        h(
          'tr',
          { dataset: { reason: r.reason } },
          h('td', { class: 'file-path' }, r.path),
          h('td', null, h('strong', null, reasonWords(r.reason)), h('span', { class: 'hint' }, ` ${r.detail}`)),
        ),
      ),
      { id: 'import-rejects' },
    ),
  );
}

function summary(result) {
  const f = result.files;
  return h(
    'p',
    { id: 'import-summary', tabindex: '-1' },
    `${plural(f.read, 'file')} read: ${f.imported} imported (${f.new} new, ${f.changed} new versions), ${f.unchanged} unchanged, ${f.rejected} not imported.`,
    result.contracts.length < f.imported ? ` The first ${result.contracts.length} imported are listed.` : '',
  );
}

function progressOf(job) {
  const p = job.progress ?? {};
  const stage = STAGE_WORDS[p.stage] ?? (job.status === 'queued' ? 'Waiting to start' : 'Working');
  let value = null;
  let words = '';
  if (p.stage === 'staging' && p.filesTotal > 0) {
    value = p.filesRead / p.filesTotal;
    words = `${p.filesRead} of ${p.filesTotal} files`;
  } else if (job.partitions && job.partitions.total > 0) {
    value = job.partitions.fractionDone;
    words = `${job.partitions.done} of ${plural(job.partitions.total, 'part')} done`;
  }
  return [
    h('span', null, `${stage}${words ? `: ${words}` : '…'}`),
    ' ',
    h('progress', { max: '1', value: value === null ? null : String(value), 'aria-label': stage }),
  ];
}

export function render(main, { session }) {
  let chosen = [];
  let timer = null;
  const input = h('input', { id: 'import-files', type: 'file', multiple: true, accept: '.zip,.pdf,.docx,.txt,.md,application/zip,application/pdf,text/plain' });
  const picked = h('p', { class: 'hint', id: 'import-picked', 'aria-live': 'polite' }, 'No files chosen yet.');
  const source = h('input', { id: 'import-source', type: 'text', value: 'files', maxlength: String(MAX_ID_LENGTH), autocomplete: 'off' });
  const start = h('button', { type: 'submit', class: 'primary', id: 'import-start' }, 'Import');
  const progress = h('div', { id: 'import-progress', role: 'status', 'aria-live': 'polite' });
  const results = h('div', { id: 'import-results' });
  const choose = (files) => {
    chosen = [...files];
    replace(picked, chosen.length === 0 ? 'No files chosen yet.' : `${plural(chosen.length, 'file')} chosen: ${chosen.map((f) => f.name).join(', ')}`);
  };
  input.addEventListener('change', () => choose(input.files));
  const drop = h('div', { class: 'drop-zone', id: 'drop-zone' }, 'Drop a zip, or PDF, Word and text files, here.');
  drop.addEventListener('dragover', (event) => {
    event.preventDefault();
    drop.classList.add('over');
  });
  drop.addEventListener('dragleave', () => drop.classList.remove('over'));
  drop.addEventListener('drop', (event) => {
    event.preventDefault();
    drop.classList.remove('over');
    choose(event.dataTransfer.files);
  });
  const allowed = session.can('post_contracts');
  const form = h(
    'form',
    { class: 'import-form', novalidate: true },
    h('label', { for: 'import-files' }, 'Files: a zip, or PDF, Word (.docx) and text files'),
    input,
    drop,
    picked,
    h('label', { for: 'import-source' }, "Source (stored with each contract; a file's path is its reference)"),
    source,
    h('div', null, start),
  );
  if (!allowed) start.disabled = true;

  const follow = async (id) => {
    try {
      const { data: job } = await api(`/v1/jobs/${id}`);
      if (job.status === 'failed') {
        replace(progress, h('p', { class: 'error-box', role: 'alert' }, `The import failed: ${job.error ?? 'no reason given'}`));
        start.disabled = false;
        return;
      }
      if (job.status !== 'finished') {
        replace(progress, ...progressOf(job));
        timer = setTimeout(() => follow(id), POLL_MS);
        return;
      }
      replace(progress, h('p', null, 'Finished.'));
      const r = job.result;
      replace(
        results,
        summary(r),
        section(
          `Imported contracts (${r.contracts.length})`,
          r.contracts.length ? contractsTable(r.contracts) : h('p', null, 'None: every file was unchanged or not imported.'),
        ),
        section(`Files not imported (${r.rejected.length})`, r.rejected.length ? rejectsTable(r.rejected) : h('p', null, 'None.')),
      );
      start.disabled = false;
      results.querySelector('#import-summary')?.focus();
    } catch (error) {
      replace(progress, errorBox(error, 'Could not follow the import'));
      start.disabled = false;
    }
  };

  form.addEventListener('submit', async (event) => {
    event.preventDefault();
    if (chosen.length === 0) {
      replace(progress, h('p', { class: 'field-problem' }, 'Choose a zip or some files first.'));
      input.focus();
      return;
    }
    const body = new FormData();
    for (const file of chosen) body.append('files', file, file.name);
    start.disabled = true;
    replace(results);
    replace(progress, h('span', null, 'Uploading…'));
    try {
      const { data: job } = await apiForm(`/v1/jobs/contracts?source=${encodeURIComponent(source.value.trim() || 'files')}`, body);
      replace(progress, ...progressOf(job));
      timer = setTimeout(() => follow(job.id), POLL_MS);
    } catch (error) {
      replace(progress, errorBox(error, 'Could not start the import'));
      start.disabled = false;
    }
  });

  replace(
    main,
    pageTitle('Import contract files'),
    h(
      'p',
      { class: 'caution', id: 'import-caution' },
      h('strong', null, 'Extraction and party parsing are proposals; the signed document stands. '),
      'A scan without a text layer is not read: no OCR is attempted. Importing the same files again adds only what is new or changed.',
    ),
    allowed ? null : h('p', { class: 'error-box' }, 'Your key may read but not post contracts: ask for a write key to import.'),
    form,
    progress,
    results,
  );
  main.querySelector('h1').focus();
  return () => clearTimeout(timer);
}
