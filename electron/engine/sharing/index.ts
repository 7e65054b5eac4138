/** The steady-state sharing engine's public face. */
export { solveSharing } from './solve-sharing';
export { sweepLoad } from './load-sweep';
