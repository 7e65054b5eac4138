/** Node entry of the `droopline` command. */
import { readFile, writeFile } from 'node:fs/promises';
import { runCli } from './run-cli';

const io = {
  out: (t: string) => void process.stdout.write(t),
  err: (t: string) => void process.stderr.write(t),
  readFile: (p: string) => readFile(p, 'utf8'),
  writeFile: (p: string, d: string | Uint8Array) => writeFile(p, d),
};

runCli(process.argv.slice(2), io).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`droopline: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 1;
  },
);
