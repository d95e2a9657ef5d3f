/**
 * Every package README carries a runnable example that some test executes.
 *
 * Most packages execute their own README example in packages/<pkg>/test/
 * (a test that reads ../README.md); those are only checked for, not run a
 * second time. Code blocks whose info string marks them runnable
 * (```ts runnable or ```js runnable) in a README that no package test reads
 * are executed here. A package without a README is listed as a todo, not a
 * failure, so that work in progress does not break the suite.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it, vi } from 'vitest';

const root = fileURLToPath(new URL('..', import.meta.url));
const packagesDir = join(root, 'packages');
const scratch = join(root, 'test', '.readme-run');

interface CodeBlock {
  language: 'ts' | 'js';
  runnable: boolean;
  source: string;
}

function codeBlocks(markdown: string): CodeBlock[] {
  const blocks: CodeBlock[] = [];
  const fence = /^```(ts|js)([^\n]*)\n([\s\S]*?)^```/gm;
  for (let m = fence.exec(markdown); m; m = fence.exec(markdown)) {
    blocks.push({ language: m[1] as 'ts' | 'js', runnable: /\brunnable\b/.test(m[2]), source: m[3] });
  }
  return blocks;
}

function filesUnder(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    if (name === 'fixtures' || name === 'node_modules') return [];
    return statSync(path).isDirectory() ? filesUnder(path) : [path];
  });
}

/** Package tests that read the package README (and so run its example themselves). */
function readmeTests(pkg: string): string[] {
  return filesUnder(join(packagesDir, pkg, 'test'))
    .filter((f) => /\.test\.[cm]?[jt]s$/.test(f))
    .filter((f) => readFileSync(f, 'utf8').includes('README.md'));
}

/** Runs one code block as a module (imports by package name resolve through the vitest aliases); returns what it logged. */
async function runBlock(name: string, block: CodeBlock): Promise<string[]> {
  mkdirSync(scratch, { recursive: true });
  const file = join(scratch, `${name}.${block.language}`);
  writeFileSync(file, block.source);
  const printed: string[] = [];
  const spy = vi.spyOn(console, 'log').mockImplementation((...args: unknown[]) => void printed.push(args.join(' ')));
  try {
    await import(/* @vite-ignore */ file);
  } finally {
    spy.mockRestore();
  }
  return printed;
}

afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const packages = readdirSync(packagesDir)
  .filter((d) => existsSync(join(packagesDir, d, 'package.json')))
  .sort();

describe('package README examples are executed by a test', () => {
  for (const pkg of packages) {
    const readmePath = join(packagesDir, pkg, 'README.md');
    if (!existsSync(readmePath)) {
      it.todo(`packages/${pkg} has a README with a runnable example`);
      continue;
    }
    const blocks = codeBlocks(readFileSync(readmePath, 'utf8'));
    const covering = readmeTests(pkg);
    if (covering.length > 0) {
      // A command-line package documents itself with shell examples, which its own test runs.
      const shellExamples = /^```sh\n/m.test(readFileSync(readmePath, 'utf8'));
      it(`packages/${pkg}: the README has a ts/js (or sh) example and ${covering.map((f) => f.slice(root.length)).join(', ')} executes it`, () => {
        expect(blocks.length > 0 || shellExamples).toBe(true);
      });
      continue;
    }
    const runnable = blocks.filter((b) => b.runnable);
    it(`packages/${pkg}: the README marks at least one ts/js block as runnable (no package test executes it)`, () => {
      expect(runnable.length).toBeGreaterThan(0);
    });
    runnable.forEach((block, i) => {
      it(`packages/${pkg}: README runnable block ${i + 1} runs without throwing`, async () => {
        await runBlock(`${pkg}-${i + 1}`, block);
      });
    });
  }
});

describe('the README block runner', () => {
  it('finds only blocks marked runnable and executes one that imports a package by name (prints r+ = 1 + √0.19 for a = 0.9, hand evaluation)', async () => {
    const markdown = [
      '```ts',
      'signature(only: string): void',
      '```',
      '```ts runnable',
      "import { kerrHole } from '@penumbra/kerr';",
      // biome-ignore lint/suspicious/noTemplateCurlyInString: the README source under test contains a template literal
      'console.log(`r+ = ${kerrHole({ a: 0.9 }).rPlus.toFixed(12)}`);',
      '```',
    ].join('\n');
    const blocks = codeBlocks(markdown);
    expect(blocks.map((b) => b.runnable)).toEqual([false, true]);
    const printed = await runBlock('self-check', blocks[1]);
    expect(printed).toEqual([`r+ = ${(1 + Math.sqrt(0.19)).toFixed(12)}`]);
  });
});
