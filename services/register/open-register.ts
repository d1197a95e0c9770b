/**
 * Who a command-line change is by: `cli:<operating-system user>`. (The CLI opens its database through
 * services/cli/open-command-database.ts.)
 */
import { userInfo } from 'node:os';

export function cliActor(): string {
  let name = process.env.USER ?? process.env.USERNAME ?? 'unknown';
  try {
    name = userInfo().username || name;
  } catch {
    // No passwd entry (some containers): the environment's name stands.
  }
  return `cli:${name}`;
}
