/** The CLI's entry, independent of the process so tests can run it in-process. */
import { CAUTION } from '../../shared-types';
import { parseArgs } from './args';
import { commands } from './commands';
import { CliInputError } from './io';
import type { CliIO } from './io';

function usage(): string {
  const lines = commands.map((c) => `  ${c.usage}\n      ${c.summary}${c.example ? `\n      example: ${c.example}` : ''}`);
  return `droopline — paralleling and synchronizing generating sets\n\nusage:\n${lines.join('\n')}\n\nexit codes: 0 result, 2 invalid input, 3 no steady state\n${CAUTION}\n`;
}

/** Runs one CLI invocation; returns the exit code. */
export async function runCli(argv: readonly string[], io: CliIO): Promise<number> {
  const [name, ...rest] = argv;
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    io.out(usage());
    return name ? 0 : 2;
  }
  const cmd = commands.find((c) => c.name === name);
  if (!cmd) {
    io.err(`droopline: unknown command "${name}"\n\n${usage()}`);
    return 2;
  }
  try {
    const args = parseArgs(rest, cmd.valueFlags);
    if (args.flags.has('help')) {
      io.out(`usage: ${cmd.usage}\n${cmd.summary}\n${cmd.example ? `example: ${cmd.example}\n` : ''}\n${CAUTION}\n`);
      return 0;
    }
    return await cmd.run(args, io);
  } catch (e) {
    if (e instanceof CliInputError) {
      io.err(`droopline ${cmd.name}: ${e.message}\nusage: ${cmd.usage}\n`);
      return 2;
    }
    io.err(`droopline ${cmd.name}: internal error: ${e instanceof Error ? e.message : String(e)}\n`);
    return 1;
  }
}
