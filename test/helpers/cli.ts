/** Runs the command line in-process (src/cli/main.ts) and captures what it prints. */
import { main } from '../../src/cli/main.ts';
import type { Io } from '../../src/cli/terminal.ts';

export async function runCli(...args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const io: Io = { out: (t) => void (out += t + '\n'), err: (t) => void (err += t + '\n') };
  const code = await main(args, io);
  return { code, out, err };
}
