/** The steady-state sharing engine's public face. */
export { solveSharing, solveSharingAtMost } from './solve-sharing';
export { sweepLoad, impliedPowerFactor } from './load-sweep';
export type { ImpliedPowerFactor } from './load-sweep';
