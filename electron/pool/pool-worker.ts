/** Entry of a pool worker (a Node worker thread): runs the handlers' pool tasks for `node-pool.ts`. */
import workerpool from 'workerpool';
import { poolTasks } from '../handlers/pool-tasks';

workerpool.worker(poolTasks);
