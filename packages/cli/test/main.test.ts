import { describe, expect, test } from 'vitest';
import { readFileSync } from 'node:fs';
import { ConvergenceError, exactDiagnostics, InputError } from '@penumbra/core';
import { commands, UsageError, type Command, type CommandEntry } from '@penumbra/cli';
import { run, runWith } from './helpers.js';

describe('dispatch, help and version', () => {
  test('every registry entry loads a command of the same name and summary', async () => {
    expect(commands.length).toBeGreaterThan(0);
    for (const entry of commands) {
      const { command } = await entry.load();
      expect([command.name, command.summary]).toEqual([entry.name, entry.summary]);
    }
  });

  test('the registry imports no command module: src/commands/index.ts has only type imports and lazy import() calls', () => {
    const source = readFileSync(new URL('../src/commands/index.ts', import.meta.url), 'utf8');
    const staticImports = source.split('\n').filter((line) => /^\s*import\s/.test(line) && !/^\s*import type\s/.test(line));
    expect(staticImports).toEqual([]);
    expect(source.match(/load: \(\) => import\('\.\/[A-Za-z]+\.js'\)/g)).toHaveLength(commands.length);
  });

  test('--version and --help load no command: they work with a registry whose loaders all fail', async () => {
    const unloadable: CommandEntry[] = commands.map((c) => ({ ...c, load: () => Promise.reject(new Error(`loaded ${c.name}`)) }));
    const version = await runWith(unloadable, '--version');
    expect(version.code).toBe(0);
    const help = await runWith(unloadable, '--help');
    expect(help.code).toBe(0);
    for (const command of commands) expect(help.stdout).toContain(command.summary);
    expect((await runWith(unloadable, 'kerr', '--a', '0.5')).stderr).toMatch(/internal error: loaded kerr/);
  });

  test('--help on every registered command prints its usage to stdout with exit code 0', async () => {
    for (const command of commands) {
      for (const flag of ['--help', '-h']) {
        const result = await run(command.name, flag);
        expect(result.code).toBe(0);
        expect(result.stdout).toContain(`Usage: penumbra ${command.name}`);
        expect(result.stderr).toBe('');
      }
      expect((await run('help', command.name)).stdout).toContain(`Usage: penumbra ${command.name}`);
    }
  });

  test('top-level --help lists every command with its summary; no arguments prints it to stderr with exit code 2', async () => {
    const help = await run('--help');
    expect(help.code).toBe(0);
    for (const command of commands) expect(help.stdout).toContain(command.summary);
    const bare = await run();
    expect(bare.code).toBe(2);
    expect(bare.stderr).toContain('Usage: penumbra <command>');
  });

  test('--version prints the cli package version', async () => {
    const result = await run('--version');
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/^penumbra \d+\.\d+\.\d+\n$/);
  });

  test('a mistyped command gets one line with exit code 2 and "did you mean \'greybody\'?"', async () => {
    const result = await run('grebody', '--spin', '0');
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/^penumbra: unknown command 'grebody'; did you mean 'greybody'\? \(commands: [^\n]*\)\n$/);
  });
  test('an unknown command is one line on stderr with exit code 2', async () => {
    const result = await run('teleport');
    expect(result.code).toBe(2);
    expect(result.stderr).toMatch(/^penumbra: unknown command 'teleport' \(commands: [^\n]*\)\n$/);
  });
});

describe('error reporting: one line on stderr, exit codes 2 / 3 / 1, no stack trace', () => {
  const probe: Command = { name: 'probe', summary: 'test command', usage: 'Usage: penumbra probe\n', run: () => 0 };
  const throwing = (error: unknown): CommandEntry => ({
    name: probe.name,
    summary: probe.summary,
    load: async () => ({ command: { ...probe, run: () => Promise.reject(error) } }),
  });

  test.each([
    ['UsageError', new UsageError('bad flag'), 2, /^penumbra: bad flag \(see 'penumbra probe --help'\)\n$/],
    ['InputError', new InputError('a', '|a| < M = 1', 2), 2, /^penumbra: invalid a = 2: allowed \|a\| < M = 1\n$/],
    [
      'ConvergenceError',
      new ConvergenceError('no luck', { ...exactDiagnostics('probe'), steps: 7 }),
      3,
      /^penumbra: not converged: no luck; diagnostics: \{"method":"probe","steps":7,[^\n]*\}\n$/,
    ],
    [
      'any other error',
      new TypeError('boom\nsecond line'),
      1,
      /^penumbra: internal error: boom second line \(set PENUMBRA_DEBUG=1 for the stack trace\)\n$/,
    ],
  ])('%s', async (_label, error, code, pattern) => {
    const result = await runWith([...commands, throwing(error)], 'probe');
    expect(result.code).toBe(code);
    expect(result.stderr).toMatch(pattern);
    expect(result.stderr.split('\n')).toHaveLength(2);
    expect(result.stderr).not.toMatch(/\n\s+at /);
    expect(result.stdout).toBe('');
  });
});
