/** Entry of a pool worker in the browser preview (a Web Worker started by `web-pool.ts`): runs the pool tasks. */
import workerpool from 'workerpool';
import { poolTasks } from '../../electron/handlers/pool-tasks';

workerpool.worker(poolTasks);
