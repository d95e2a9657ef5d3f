import { commands, main, type CliIO, type CommandEntry } from '@penumbra/cli';

export interface RunResult {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs `penumbra ...argv` in-process and captures its output. */
export async function run(...argv: string[]): Promise<RunResult> {
  return runWith(commands, ...argv);
}

/** Runs `penumbra ...argv` in-process with the given command registry. */
export async function runWith(registry: readonly CommandEntry[], ...argv: string[]): Promise<RunResult> {
  let stdout = '';
  let stderr = '';
  const io: CliIO = {
    stdout: (text) => {
      stdout += text;
    },
    stderr: (text) => {
      stderr += text;
    },
  };
  const code = await main(argv, io, registry);
  return { code, stdout, stderr };
}
