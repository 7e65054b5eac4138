/** Number formats for tables and exports: the shared presentation module's, under the renderer's short names. */
export { formatNumber as fmt, formatPF as fmtPF, formatSigned as fmtSigned } from '../../../shared-types';
