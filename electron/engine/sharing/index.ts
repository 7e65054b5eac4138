/** The steady-state sharing engine's public face. */
export { solveSharing, solveSharingAtMost, solveSharingFigures } from './solve-sharing';
export type { SharingScratch } from './solve-sharing';
export { createSharingFigures } from './sharing-result';
export type { SharingFigures } from './sharing-result';
export { sweepLoad, impliedPowerFactor } from './load-sweep';
export type { ImpliedPowerFactor } from './load-sweep';
