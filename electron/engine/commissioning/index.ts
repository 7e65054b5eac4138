/** Commissioning: test records, the fit of the model to them, the record of a set. */
export { inspectTestRecord, parseTestRecord, MAX_RECORD_ROWS, MAX_RECORD_S } from './test-record';
export { fitParameterInfo, parameterValue, withParameters } from './fit-parameters';
export { recordVerdict } from './record-verdict';
export type { VerdictInput } from './record-verdict';
export type { FitHooks } from './fit-model';
export { fitTestRecord, DEFAULT_FIT_ITERATIONS, MAX_FIT_ITERATIONS, DEFAULT_FIT_STEP_MS } from './fit-model';
export { commissioningRecordData } from './commissioning-record';
export type { CommissioningRecordData } from './commissioning-record';
