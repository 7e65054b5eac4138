/** Node entry of the `droopline` command. */
import { fileURLToPath } from 'node:url';
import { createNodePool } from '../pool/node-pool';
import { nodeIO } from './node-io';
import { runCli } from './run-cli';

// Long jobs (tolerance samples, time-domain closing maps) run on one worker thread per core; the workers start
// only when such a job asks for them. The worker entry is built beside this bundle (vite.cli.config.ts).
const pool = createNodePool(fileURLToPath(new URL('./pool-worker.mjs', import.meta.url)));

runCli(process.argv.slice(2), { ...nodeIO, pool })
  .then(
    (code) => {
      process.exitCode = code;
    },
    (e: unknown) => {
      process.stderr.write(`droopline: ${e instanceof Error ? e.message : String(e)}\n`);
      process.exitCode = 1;
    },
  )
  .finally(() => pool.close());
