/**
 * The error catalogue (docs/errors.md) as a page the service serves itself at /docs/errors, so that /docs and
 * every problem answer point at something the caller can open. The file is read once when the routes are
 * built; the page renders the small part of Markdown that file uses (headings, paragraphs, bullet lists, fenced
 * code, `code`) and escapes everything else, so a character in the file can never become markup. Each code's
 * section gets the code as its anchor: /docs/errors#NOT_FOUND.
 */
import { readFileSync } from 'node:fs';

export const ERRORS_FILE = new URL('../../docs/errors.md', import.meta.url);

function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
}

/** Inline `code` spans; the rest escaped. */
function inline(text: string): string {
  return text
    .split('`')
    .map((part, i) => (i % 2 === 1 ? `<code>${escapeHtml(part)}</code>` : escapeHtml(part)))
    .join('');
}

/** Markdown blocks of docs/errors.md to HTML. */
export function renderCatalogue(markdown: string): string {
  const out: string[] = [];
  const lines = markdown.replace(/\r\n?/g, '\n').split('\n');
  let paragraph: string[] = [];
  let list: string[] | undefined;
  const flush = (): void => {
    if (paragraph.length > 0) out.push(`<p>${inline(paragraph.join(' '))}</p>`);
    paragraph = [];
    if (list) out.push(`<ul>${list.map((item) => `<li>${inline(item)}</li>`).join('')}</ul>`);
    list = undefined;
  };
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i]!;
    if (line.startsWith('```')) {
      flush();
      const code: string[] = [];
      while (++i < lines.length && !lines[i]!.startsWith('```')) code.push(lines[i]!);
      out.push(`<pre>${escapeHtml(code.join('\n'))}</pre>`);
    } else if (/^#{1,3} /.test(line)) {
      flush();
      const level = line.indexOf(' ');
      const title = line.slice(level + 1).trim();
      const anchor = /^[A-Z][A-Z0-9_]*$/.test(title) ? ` id="${title}"` : '';
      out.push(`<h${level}${anchor}>${inline(title)}</h${level}>`);
    } else if (line.startsWith('- ')) {
      if (paragraph.length > 0) flush();
      list ??= [];
      list.push(line.slice(2).trim());
    } else if (line.trim() === '') {
      flush();
    } else if (list && /^\s+\S/.test(line)) {
      list[list.length - 1] += ` ${line.trim()}`;
    } else {
      paragraph.push(line.trim());
    }
  }
  flush();
  return out.join('\n');
}

export function errorsPage(markdown = readFileSync(ERRORS_FILE, 'utf8')): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>Errors — cpreg API</title>
<link rel="icon" href="data:,">
<style>
  body { margin:0 auto; max-width:860px; padding:16px 24px; font:15px/1.5 system-ui, sans-serif; color:#1d2330; background:#fafbfc; }
  h2 { font-family: ui-monospace, monospace; font-size:16px; margin-top:28px; border-top:1px solid #d9dde5; padding-top:12px; }
  pre, code { font-family: ui-monospace, monospace; font-size:13px; }
  pre { background:#f3f5f8; border:1px solid #d9dde5; padding:8px; overflow:auto; border-radius:4px; }
  p, li { overflow-wrap:anywhere; }
</style>
</head>
<body>
<p><a href="/docs">API reference</a></p>
${renderCatalogue(markdown)}
</body>
</html>
`;
}
