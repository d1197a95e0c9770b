/**
 * The live route table of a built app, read from fastify's own printRoutes tree (commonPrefix off, so each
 * line is one radix-tree node whose text extends its parent's path). New routes are covered without a list.
 */
import type { FastifyInstance } from 'fastify';

export interface LiveRoute {
  method: string;
  path: string;
}

export function liveRoutes(app: FastifyInstance): LiveRoute[] {
  const stack: string[] = [];
  const out: LiveRoute[] = [];
  for (const line of app.printRoutes({ commonPrefix: false }).split('\n')) {
    const at = line.search(/[├└]── /u);
    if (at < 0) continue;
    const depth = at / 4;
    const rest = line.slice(at + 4);
    const open = rest.lastIndexOf(' (');
    const segment = open < 0 ? rest : rest.slice(0, open);
    const path = (depth > 0 ? stack[depth - 1]! : '') + segment;
    stack[depth] = path;
    stack.length = depth + 1;
    if (open < 0) continue;
    const methods = rest.slice(open + 2, rest.length - 1).split(', ');
    for (const method of methods) if (method !== 'HEAD') out.push({ method, path });
  }
  return out;
}
