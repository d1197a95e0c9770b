/**
 * The message for a PostgreSQL connection that failed at opening: what went wrong, in the terms of the URL that was
 * given (host, port, database), and what to check. The driver's errors name a code, not the fix.
 */

export function explainConnectError(error: unknown, where: { host: string; port: number; database: string }): string {
  const err = error as { code?: string; message?: string; errors?: Array<{ code?: string }> };
  const code = err.code ?? err.errors?.[0]?.code;
  const at = `PostgreSQL at ${where.host}:${where.port}`;
  const fix = 'check --db or DATABASE_URL';
  switch (code) {
    case 'ECONNREFUSED':
      return `cannot reach ${at}: connection refused (is the server running?); ${fix}`;
    case 'ENOTFOUND':
    case 'EAI_AGAIN':
      return `cannot reach ${at}: unknown host ${where.host}; ${fix}`;
    case '3D000':
      return `${at} has no database "${where.database}"; create it or ${fix}`;
    case '28P01':
    case '28000':
      return `${at} refused the login: ${err.message}; ${fix}`;
    default:
      if (/timeout/i.test(err.message ?? '')) return `cannot reach ${at}: no answer (connection timed out); ${fix}`;
      return `cannot reach ${at}: ${oneLine(err.message || code || 'unknown error')}; ${fix}`;
  }
}

function oneLine(text: string): string {
  return text.replace(/\s+/g, ' ').trim();
}
