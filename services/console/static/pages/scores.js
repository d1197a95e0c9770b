// Score distribution of recent resolutions with the two thresholds marked, and the export downloads.
import { api, download } from '../api.js';
import { h, num, pageTitle, plural, replace, s } from '../dom.js';
import { dataTable, errorBox, section, toast } from '../ui.js';

const STATUS_ORDER = ['linked', 'review', 'new', 'own_entity'];
const STATUS_WORDS = { linked: 'linked', review: 'waiting for review', new: 'new counterparty', own_entity: 'our own entity' };
const statusWords = (status) => STATUS_WORDS[status] ?? status.replaceAll('_', ' ');

/** The statuses present in the buckets, in our order. */
function statusesOf(buckets) {
  const present = new Set(buckets.flatMap((b) => Object.keys(b.byStatus)));
  return [...STATUS_ORDER.filter((st) => present.has(st)), ...[...present].filter((st) => !STATUS_ORDER.includes(st)).sort()];
}
const EXPORTS = [
  { kind: 'register', words: 'Register', about: 'every counterparty with its names and identifiers' },
  { kind: 'links', words: 'Links', about: 'every mention with the counterparty it names' },
  { kind: 'history', words: 'History', about: 'every change, who made it and why' },
  { kind: 'review', words: 'Review items', about: 'the review queue and the decisions' },
];

function ticks(min, max, count = 8) {
  const raw = (max - min) / count;
  const step = [1, 2, 2.5, 5, 10].map((m) => m * 10 ** Math.floor(Math.log10(raw || 1))).find((x) => x >= raw) ?? raw;
  const out = [];
  for (let t = Math.ceil(min / step) * step; t <= max + 1e-9; t += step) out.push(Number(t.toFixed(6)));
  return out;
}

/** The chart, drawn for `width` pixels so that its text keeps its size on any window. */
export function histogram(stats, width = 900) {
  const W = Math.round(Math.max(320, Math.min(900, width)));
  const H = W < 600 ? 260 : 340;
  const pad = { l: 52, r: 16, t: 40, b: 46 };
  const { min, max, buckets, linkAt, newAt } = stats;
  const peak = Math.max(1, ...buckets.map((b) => b.count));
  const x = (v) => pad.l + ((v - min) / (max - min || 1)) * (W - pad.l - pad.r);
  const y = (c) => H - pad.b - (c / peak) * (H - pad.t - pad.b);
  const statuses = statusesOf(buckets);
  const bars = buckets.flatMap((b) => {
    let base = 0;
    return statuses.map((st) => {
      const n = b.byStatus[st] ?? 0;
      if (n === 0) return null;
      const rect = s(
        'rect',
        {
          x: x(b.from) + 1,
          width: Math.max(1, x(b.to) - x(b.from) - 2),
          y: y(base + n),
          height: y(base) - y(base + n),
          class: `hist hist-${STATUS_ORDER.includes(st) ? st : 'other'}`,
        },
        s('title', null, `${num(b.from)} to ${num(b.to)}: ${n} ${statusWords(st)}`),
      );
      base += n;
      return rect;
    });
  });
  const yTicks = ticks(0, peak, 4).filter((t) => Number.isInteger(t));
  return s(
    'svg',
    {
      viewBox: `0 0 ${W} ${H}`,
      class: 'histogram',
      id: 'score-chart',
      role: 'img',
      'aria-label': `Scores of ${stats.count} recent resolutions from ${num(min)} to ${num(max)}; new below ${num(newAt)}, linked at ${num(linkAt)} or more, between them a person decides`,
    },
    s('rect', { x: x(newAt), y: pad.t, width: Math.max(0, x(linkAt) - x(newAt)), height: H - pad.b - pad.t, class: 'zone-doubt' }),
    s(
      'text',
      { x: (x(newAt) + x(linkAt)) / 2, y: pad.t + 16, 'text-anchor': 'middle', class: 'zone-label' },
      x(linkAt) - x(newAt) < 170 ? 'doubtful' : 'doubtful: a person reviews',
    ),
    yTicks.map((t) => [
      s('line', { x1: pad.l, x2: W - pad.r, y1: y(t), y2: y(t), class: 'grid' }),
      s('text', { x: pad.l - 6, y: y(t) + 4, 'text-anchor': 'end', class: 'tick' }, String(t)),
    ]),
    bars,
    s('line', { x1: pad.l, x2: W - pad.r, y1: H - pad.b, y2: H - pad.b, class: 'axis' }),
    ticks(min, max, W < 600 ? 5 : 8).map((t) => [
      s('line', { x1: x(t), x2: x(t), y1: H - pad.b, y2: H - pad.b + 5, class: 'axis' }),
      s('text', { x: x(t), y: H - pad.b + 18, 'text-anchor': 'middle', class: 'tick' }, String(t)),
    ]),
    s('text', { x: (pad.l + W - pad.r) / 2, y: H - 6, 'text-anchor': 'middle', class: 'axis-title' }, 'match score (weight of evidence)'),
    [
      { v: newAt, label: `new below ${num(newAt)}`, cls: 'threshold-new', anchor: 'end', dx: -4 },
      { v: linkAt, label: `linked from ${num(linkAt)}`, cls: 'threshold-link', anchor: 'start', dx: 4 },
    ].map((t) => [
      s('line', { x1: x(t.v), x2: x(t.v), y1: pad.t - 22, y2: H - pad.b, class: `threshold ${t.cls}` }),
      s('text', { x: x(t.v) + t.dx, y: pad.t - 10, 'text-anchor': t.anchor, class: `threshold-label ${t.cls}` }, t.label),
    ]),
  );
}

export async function render(main) {
  const { data: stats } = await api('/v1/stats/scores?buckets=40&limit=5000');
  // The panel's inner width: the page's width less the panel's padding and border.
  const chart = stats.count === 0 || stats.min === null ? h('p', { class: 'empty' }, 'No scored resolutions yet.') : histogram(stats, main.clientWidth - 60);
  const table = h(
    'details',
    { class: 'data-table' },
    h('summary', null, 'The numbers behind the chart'),
    h(
      'div',
      { class: 'table-wrap' },
      dataTable(
        ['From', 'To', 'Count', 'By status'],
        stats.buckets
          .filter((b) => b.count > 0)
          .map((b) =>
            h(
              'tr',
              null,
              h('td', { class: 'num' }, num(b.from)),
              h('td', { class: 'num' }, num(b.to)),
              h('td', { class: 'num' }, String(b.count)),
              h(
                'td',
                null,
                Object.entries(b.byStatus)
                  .map(([k, v]) => `${k} ${v}`)
                  .join(', '),
              ),
            ),
          ),
      ),
    ),
  );
  const downloads = h('div', { class: 'exports' });
  const status = h('div', { class: 'export-status', role: 'status', 'aria-live': 'polite' });
  for (const e of EXPORTS) {
    const row = h('div', { class: 'export-row' }, h('div', null, h('strong', null, e.words), h('span', { class: 'muted' }, ` — ${e.about}`)));
    const buttons = h('div', { class: 'export-buttons' });
    for (const format of ['csv', 'ndjson']) {
      const button = h('button', { type: 'button', class: 'small', dataset: { export: `${e.kind}.${format}` } }, format.toUpperCase());
      button.addEventListener('click', async () => {
        button.disabled = true;
        replace(status, `Preparing ${e.words.toLowerCase()} (${format})…`);
        try {
          const bytes = await download(`/v1/exports/${e.kind}?format=${format}`, `cpreg-${e.kind}.${format}`);
          replace(status, h('p', { class: 'ok' }, `Downloaded cpreg-${e.kind}.${format} (${plural(bytes, 'byte')}).`));
          toast(`cpreg-${e.kind}.${format} downloaded.`);
        } catch (error) {
          replace(status, errorBox(error, 'Export failed'));
        } finally {
          button.disabled = false;
        }
      });
      buttons.append(button);
    }
    row.append(buttons);
    downloads.append(row);
  }
  replace(
    main,
    pageTitle('Scores and exports'),
    section(
      'How sure the register was',
      h(
        'p',
        null,
        `The last ${plural(stats.count, 'scored resolution')}. At or above ${num(stats.linkAt)} a mention is linked on its own; below ${num(stats.newAt)} it becomes a new counterparty; in between it waits for a reviewer.`,
      ),
      h(
        'p',
        { class: 'legend' },
        statusesOf(stats.buckets).map((st) => [h('span', { class: `key hist-${STATUS_ORDER.includes(st) ? st : 'other'}` }), ` ${statusWords(st)}  `]),
      ),
      h('div', { class: 'chart-wrap' }, chart),
      table,
    ),
    section('Exports', h('p', null, 'Each export is the whole register at this moment, streamed by the service.'), downloads, status),
  );
  main.querySelector('h1').focus();
}
