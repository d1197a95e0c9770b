/**
 * An SVG line plot of precision and recall (and F1) against the link threshold, readable by a person:
 * titled, both axes labelled with ticks, a legend, and a marker at the chosen threshold.
 */
export interface SweepPoint {
  threshold: number;
  precision: number;
  recall: number;
  f1: number;
}

const WIDTH = 720;
const HEIGHT = 440;
const LEFT = 70;
const RIGHT = 170;
const TOP = 50;
const BOTTOM = 60;

export function precisionRecallSvg(points: readonly SweepPoint[], options: { title: string; chosen?: number }): string {
  if (points.length === 0) throw new Error('precisionRecallSvg: no sweep points to plot');
  const sorted = [...points].sort((a, b) => a.threshold - b.threshold);
  const xMin = (sorted[0] as SweepPoint).threshold;
  const xMax = Math.max((sorted[sorted.length - 1] as SweepPoint).threshold, xMin + 1e-9);
  const plotW = WIDTH - LEFT - RIGHT;
  const plotH = HEIGHT - TOP - BOTTOM;
  const x = (v: number): number => LEFT + ((v - xMin) / (xMax - xMin)) * plotW;
  const y = (v: number): number => TOP + (1 - v) * plotH;
  const parts: string[] = [];
  parts.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${HEIGHT}" viewBox="0 0 ${WIDTH} ${HEIGHT}" font-family="sans-serif" font-size="12">`,
  );
  parts.push(`<rect width="${WIDTH}" height="${HEIGHT}" fill="white"/>`);
  parts.push(`<text x="${WIDTH / 2}" y="24" text-anchor="middle" font-size="15">${escapeXml(options.title)}</text>`);
  for (let i = 0; i <= 5; i++) {
    const v = i / 5;
    parts.push(`<line x1="${LEFT}" x2="${LEFT + plotW}" y1="${y(v)}" y2="${y(v)}" stroke="#ddd"/>`);
    parts.push(`<text x="${LEFT - 8}" y="${y(v) + 4}" text-anchor="end">${v.toFixed(1)}</text>`);
  }
  for (let i = 0; i <= 6; i++) {
    const v = xMin + ((xMax - xMin) * i) / 6;
    parts.push(`<line x1="${x(v)}" x2="${x(v)}" y1="${TOP + plotH}" y2="${TOP + plotH + 5}" stroke="black"/>`);
    parts.push(`<text x="${x(v)}" y="${TOP + plotH + 20}" text-anchor="middle">${formatTick(v)}</text>`);
  }
  parts.push(`<line x1="${LEFT}" x2="${LEFT}" y1="${TOP}" y2="${TOP + plotH}" stroke="black"/>`);
  parts.push(`<line x1="${LEFT}" x2="${LEFT + plotW}" y1="${TOP + plotH}" y2="${TOP + plotH}" stroke="black"/>`);
  parts.push(`<text x="${LEFT + plotW / 2}" y="${HEIGHT - 15}" text-anchor="middle">link threshold (match score in bits)</text>`);
  parts.push(`<text x="18" y="${TOP + plotH / 2}" text-anchor="middle" transform="rotate(-90 18 ${TOP + plotH / 2})">pairwise precision / recall / F1</text>`);
  const series: { key: keyof SweepPoint; label: string; colour: string; dash: string }[] = [
    { key: 'precision', label: 'precision', colour: '#1f77b4', dash: '' },
    { key: 'recall', label: 'recall', colour: '#d62728', dash: '6 3' },
    { key: 'f1', label: 'F1', colour: '#2ca02c', dash: '2 3' },
  ];
  series.forEach((s, i) => {
    const path = sorted.map((p) => `${x(p.threshold).toFixed(1)},${y(p[s.key]).toFixed(1)}`).join(' ');
    const dash = s.dash ? ` stroke-dasharray="${s.dash}"` : '';
    parts.push(`<polyline fill="none" stroke="${s.colour}" stroke-width="2"${dash} points="${path}"/>`);
    const ly = TOP + 10 + i * 22;
    parts.push(`<line x1="${WIDTH - RIGHT + 20}" x2="${WIDTH - RIGHT + 50}" y1="${ly}" y2="${ly}" stroke="${s.colour}" stroke-width="2"${dash}/>`);
    parts.push(`<text x="${WIDTH - RIGHT + 56}" y="${ly + 4}">${s.label}</text>`);
  });
  if (options.chosen !== undefined && options.chosen >= xMin && options.chosen <= xMax) {
    const cx = x(options.chosen);
    parts.push(`<line x1="${cx}" x2="${cx}" y1="${TOP}" y2="${TOP + plotH}" stroke="#555" stroke-dasharray="4 4"/>`);
    const ly = TOP + 10 + 3 * 22;
    parts.push(`<line x1="${WIDTH - RIGHT + 20}" x2="${WIDTH - RIGHT + 50}" y1="${ly}" y2="${ly}" stroke="#555" stroke-dasharray="4 4"/>`);
    parts.push(`<text x="${WIDTH - RIGHT + 56}" y="${ly + 4}">links from ${formatTick(options.chosen)}</text>`);
  }
  parts.push('</svg>');
  return parts.join('\n') + '\n';
}

function formatTick(v: number): string {
  return Math.abs(v) >= 10 ? v.toFixed(0) : v.toFixed(2);
}

function escapeXml(text: string): string {
  return text.replaceAll('&', '&amp;').replaceAll('<', '&lt;').replaceAll('>', '&gt;').replaceAll('"', '&quot;');
}
