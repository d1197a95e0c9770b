import { describe, expect, it } from 'vitest';
import { buildProgram } from '../../../services/cli/main.ts';
import { runCli } from '../../support/cli.ts';

describe('cpreg flags', () => {
  it('an unknown flag on serve names it and lists the valid ones', async () => {
    const result = await runCli(['serve', '--prot', '8080']);
    expect(result.code).not.toBe(0);
    expect(result.stderr).toContain("unknown option '--prot'");
    for (const flag of ['--port', '--host', '--db', '--db-timeout']) expect(result.stderr).toContain(flag);
  });

  it('an unknown flag on migrate lists the valid ones', async () => {
    const result = await runCli(['migrate', '--dbase', 'x']);
    expect(result.code).not.toBe(0);
    expect(result.stderr).toContain("unknown option '--dbase'");
    for (const flag of ['--db', '--json']) expect(result.stderr).toContain(flag);
  });

  it('a bad --db-timeout is refused with the accepted range', async () => {
    const result = await runCli(['serve', '--db-timeout', 'soon']);
    expect(result.code).not.toBe(0);
    expect(result.stderr).toContain('--db-timeout');
    expect(result.stderr).toContain('milliseconds from 1 to 600000');
  });

  it('cpreg --help lists serve, migrate and demo', async () => {
    const result = await runCli(['--help']);
    expect(result.code).toBe(0);
    for (const command of ['serve', 'migrate', 'demo']) expect(result.stdout).toMatch(new RegExp(`^\\s+${command}\\b`, 'm'));
  });

  it('every command has a description and --help', () => {
    const program = buildProgram();
    expect(program.commands.length).toBeGreaterThan(0);
    for (const command of program.commands) {
      expect(command.description(), `${command.name()} has no description`).not.toBe('');
      expect(command.helpInformation()).toContain('--help');
    }
  });
});
