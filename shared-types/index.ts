/** Public face of the shared types: the plant model, results and the engine contract. */
export * from './plant';
export * from './errors';
export type * from './describe';
export type * from './sharing';
export * from './sync';
export * from './angle';
export * from './laws';
export * from './simulation';
export type * from './progress';
export * from './engine-api';
export type * from './bridge';
export * from './trainer';
export * from './project';
export type * from './report';
export * from './planner';
export * from './host-api';
export * from './presentation';
export * from './cable-table';
