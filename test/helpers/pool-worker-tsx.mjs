// Test entry of a pool worker: the TypeScript worker under tsx (the app and the CLI run the built pool-worker.mjs).
import { register } from 'tsx/esm/api';

register();
await import('../../electron/pool/pool-worker.ts');
