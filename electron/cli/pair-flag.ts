import { CliInputError } from './io';
import type { CliArgs } from './io';

/** Reads a `LO,HI` flag as a band, or throws naming the flag and the rule. */
export function pairFlag(args: CliArgs, name: string): { min: number; max: number } | undefined {
  const v = args.flags.get(name);
  if (v === undefined) return undefined;
  const parts = typeof v === 'string' ? v.split(',').map((p) => Number(p.trim())) : [];
  if (parts.length !== 2 || !parts.every(Number.isFinite)) throw new CliInputError(`--${name}: must be two numbers LO,HI`);
  const [min, max] = parts as [number, number];
  if (!(min < max)) throw new CliInputError(`--${name}: LO must be below HI`);
  return { min, max };
}
