import { CliInputError } from './io';
import type { CliArgs } from './io';

/** Splits argv into positionals and flags; `valueFlags` take the next word as their value. */
export function parseArgs(argv: readonly string[], valueFlags: readonly string[] = []): CliArgs {
  const positional: string[] = [];
  const flags = new Map<string, string | true>();
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a.startsWith('--')) {
      const [name, inline] = a.slice(2).split('=', 2) as [string, string | undefined];
      if (valueFlags.includes(name)) {
        const v = inline ?? argv[++i];
        if (v === undefined) throw new CliInputError(`--${name}: needs a value`);
        flags.set(name, v);
      } else flags.set(name, true);
    } else positional.push(a);
  }
  return { positional, flags };
}

/** Reads a numeric flag, or throws naming the flag and the rule. */
export function numberFlag(args: CliArgs, name: string): number | undefined {
  const v = args.flags.get(name);
  if (v === undefined) return undefined;
  const n = typeof v === 'string' ? Number(v) : NaN;
  if (!Number.isFinite(n)) throw new CliInputError(`--${name}: must be a number`);
  return n;
}
