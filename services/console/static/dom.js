// Small DOM helpers: elements from a tag, attributes and children; no framework.

const SVG_NS = 'http://www.w3.org/2000/svg';

function append(parent, children) {
  for (const child of children.flat(Infinity)) {
    if (child === null || child === undefined || child === false) continue;
    parent.append(child instanceof Node ? child : document.createTextNode(String(child)));
  }
}

function setAttributes(element, attrs) {
  for (const [name, value] of Object.entries(attrs ?? {})) {
    if (value === null || value === undefined || value === false) continue;
    if (name.startsWith('on') && typeof value === 'function') element.addEventListener(name.slice(2), value);
    else if (name === 'dataset') Object.assign(element.dataset, value);
    else if (name === 'value' && 'value' in element) element.value = value;
    else if (name === 'checked' || name === 'disabled' || name === 'hidden') element[name] = Boolean(value);
    else element.setAttribute(name, value === true ? '' : String(value));
  }
}

/** h('a', { href: '#/x', class: 'link' }, 'text', child…) */
export function h(tag, attrs, ...children) {
  const element = document.createElement(tag);
  setAttributes(element, attrs);
  append(element, children);
  return element;
}

/** The same for SVG elements. */
export function s(tag, attrs, ...children) {
  const element = document.createElementNS(SVG_NS, tag);
  setAttributes(element, attrs);
  append(element, children);
  return element;
}

export function clear(element) {
  while (element.firstChild) element.firstChild.remove();
  return element;
}

export function replace(element, ...children) {
  clear(element);
  append(element, children);
  return element;
}

/** "2 Dec 2026, 01:15" in the reader's locale and time zone, with the ISO time as the title. */
export function when(iso) {
  if (!iso) return '';
  const date = new Date(iso);
  const text = date.toLocaleString(undefined, { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' });
  return h('time', { datetime: iso, title: iso }, text);
}

export function plural(count, one, many = `${one}s`) {
  return `${count} ${count === 1 ? one : many}`;
}

/** A number with at most `digits` decimals. */
export function num(value, digits = 2) {
  if (value === null || value === undefined || Number.isNaN(value)) return '—';
  return String(Number(Number(value).toFixed(digits)));
}

/** The text with [start, end) ranges wrapped in <mark>. */
export function highlighted(text, ranges) {
  const parts = [];
  let at = 0;
  const sorted = [...(ranges ?? [])].filter((r) => Array.isArray(r) && r[1] > r[0]).sort((a, b) => a[0] - b[0]);
  for (const [start, end] of sorted) {
    if (start < at) continue;
    if (start > at) parts.push(text.slice(at, start));
    parts.push(h('mark', null, text.slice(start, end)));
    at = end;
  }
  if (at < text.length) parts.push(text.slice(at));
  return parts;
}

/** Calls fn after `ms` of quiet. */
export function debounce(fn, ms) {
  let timer;
  return (...args) => {
    clearTimeout(timer);
    timer = setTimeout(() => fn(...args), ms);
  };
}

/** The browser tab's title for a page: its own heading first, then the console's name. */
export function documentTitle(text) {
  return text ? `${text} · cpreg console` : 'cpreg console';
}

/**
 * A heading that takes focus after navigation, so keyboard and screen-reader users start at the page's title;
 * the document title (the tab, the history, a bookmark) says the same.
 */
export function pageTitle(text, ...extra) {
  if (typeof document !== 'undefined') document.title = documentTitle(text);
  return h('h1', { tabindex: '-1', class: 'page-title' }, text, ...extra);
}
