// The console's only way to the register: the public /v1 API with the key kept for this browser session.

const KEY_ITEM = 'cpreg.console.apiKey';

export function storedKey() {
  return sessionStorage.getItem(KEY_ITEM);
}

export function storeKey(key) {
  sessionStorage.setItem(KEY_ITEM, key);
}

export function forgetKey() {
  sessionStorage.removeItem(KEY_ITEM);
}

/** An answer other than 2xx, carrying the problem details (RFC 9457) the API sent. */
export class ApiProblem extends Error {
  constructor(status, problem) {
    super(problem.detail || problem.title || `HTTP ${status}`);
    this.status = status;
    this.code = problem.code || (status === 0 ? 'NETWORK' : `HTTP_${status}`);
    this.title = problem.title || '';
    this.detail = problem.detail || '';
    this.errors = Array.isArray(problem.errors) ? problem.errors : [];
    this.problem = problem;
  }
}

const listeners = new Set();
/** Told when the API answers 401 (key unknown or revoked): the console signs out. */
export function onUnauthenticated(listener) {
  listeners.add(listener);
}

function headers(key, extra, hasBody) {
  const out = { accept: 'application/json, application/problem+json', ...extra };
  if (key) out.authorization = `Bearer ${key}`;
  if (hasBody) out['content-type'] = 'application/json';
  return out;
}

async function problemOf(response) {
  try {
    return await response.json();
  } catch {
    return { title: response.statusText || `HTTP ${response.status}` };
  }
}

/**
 * Calls the API: answers { data, etag, status }. GETs of a merged counterparty follow the 308 to the survivor
 * (fetch does that by itself; the data then names the survivor's id).
 */
export async function api(path, { method = 'GET', body, key = storedKey(), signal, extraHeaders } = {}) {
  let response;
  try {
    response = await fetch(path, {
      method,
      headers: headers(key, extraHeaders, body !== undefined),
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
      cache: 'no-store',
    });
  } catch (error) {
    if (error && error.name === 'AbortError') throw error;
    throw new ApiProblem(0, { title: 'No answer', detail: 'the service did not answer; check that it is running and the network is up', code: 'NETWORK' });
  }
  if (!response.ok) {
    const problem = new ApiProblem(response.status, await problemOf(response));
    // Only the signed-in key going bad signs the console out (a wrong key typed at sign-in does not).
    if (response.status === 401 && key && key === storedKey()) for (const listener of listeners) listener(problem);
    throw problem;
  }
  const data = response.status === 204 ? null : await response.json();
  return { data, etag: response.headers.get('etag'), status: response.status };
}

/** Sends a form with files (multipart/form-data; the browser sets the boundary): answers { data, status }. */
export async function apiForm(path, form, { method = 'POST' } = {}) {
  const key = storedKey();
  let response;
  try {
    response = await fetch(path, { method, headers: headers(key, {}, false), body: form, cache: 'no-store' });
  } catch {
    throw new ApiProblem(0, { title: 'No answer', detail: 'the service did not answer; check that it is running and the network is up', code: 'NETWORK' });
  }
  if (!response.ok) {
    const problem = new ApiProblem(response.status, await problemOf(response));
    if (response.status === 401 && key) for (const listener of listeners) listener(problem);
    throw problem;
  }
  return { data: await response.json(), status: response.status };
}

/** Fetches an export with the key and hands it to the browser as a file download. */
export async function download(path, filename) {
  let response;
  try {
    response = await fetch(path, { headers: headers(storedKey(), {}, false), cache: 'no-store' });
  } catch {
    throw new ApiProblem(0, { title: 'No answer', detail: 'the service did not answer', code: 'NETWORK' });
  }
  if (!response.ok) throw new ApiProblem(response.status, await problemOf(response));
  const blob = await response.blob();
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = filename;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
  return blob.size;
}

// What each problem code means to a person at the console; the API's own detail follows.
const PLAIN = {
  NETWORK: 'The service could not be reached.',
  UNAUTHENTICATED: 'The API key was not accepted. Sign in again with a valid key.',
  FORBIDDEN: 'Your key is not allowed to do this.',
  NOT_FOUND: 'That record does not exist.',
  VALIDATION_FAILED: 'The request was not accepted as written.',
  PRECONDITION_FAILED: 'Someone changed this record since the page loaded. Reload the page and try again.',
  PRECONDITION_REQUIRED: 'The service needs to know which version of the record you saw. Reload the page and try again.',
  CONFLICT: 'The register refused the change because it conflicts with its current state.',
  CANNOT_LINK: 'A reviewer has recorded that these are different; they cannot be joined.',
  COUNTERPARTY_MERGED: 'That counterparty has been merged into another one.',
  UNDO_BLOCKED: 'This change cannot be undone while later changes that depend on it stand. Undo those first.',
  ALREADY_UNDONE: 'This change has already been undone.',
  NOT_UNDOABLE: 'This kind of change cannot be undone.',
  IDENTIFIER_TAKEN: 'That identifier already belongs to another counterparty.',
  RATE_LIMITED: 'Too many requests in the last minute. Wait a little and try again.',
  BUSY_RETRY: 'The register is busy. Try again in a moment.',
  PAYLOAD_TOO_LARGE: 'The request is larger than the service accepts.',
  ARCHIVE_REFUSED: 'The archive cannot be imported as it is.',
  UNSUPPORTED_MEDIA_TYPE: 'The service does not take this kind of upload.',
  DATABASE_UNAVAILABLE: 'The service cannot reach its database right now.',
  ROUTE_NOT_FOUND: 'The console asked for something the service does not offer.',
};

/** A sentence for a person: what happened in plain words, the API's detail, and the problem's code. */
export function plainWords(error) {
  if (error instanceof ApiProblem) {
    const lead = PLAIN[error.code] || (error.status >= 500 ? 'The service failed to answer this request.' : 'The request was refused.');
    const fields = error.errors.map((e) => `${e.pointer || e.in || 'field'}: ${e.message}`).join('; ');
    const detail = [error.detail, fields].filter(Boolean).join(' — ');
    return { lead, detail, code: error.code, status: error.status };
  }
  return { lead: 'Something went wrong in the console.', detail: String(error && error.message ? error.message : error), code: 'CONSOLE', status: 0 };
}
