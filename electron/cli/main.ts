/** Node entry of the `droopline` command. */
import { nodeIO } from './node-io';
import { runCli } from './run-cli';

runCli(process.argv.slice(2), nodeIO).then(
  (code) => {
    process.exitCode = code;
  },
  (e: unknown) => {
    process.stderr.write(`droopline: ${e instanceof Error ? e.message : String(e)}\n`);
    process.exitCode = 1;
  },
);
