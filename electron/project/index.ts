/** Project files: reading (with migration), writing text, and their errors. Pure code (no I/O). */
export { parseProject, serializeProject, MAX_PROJECT_CHARS, CHECKSUM_MISMATCH } from './parse-project';
export { ProjectFileError } from './project-file-error';
export type { ProjectFileProblem } from './project-file-error';
export { migrateToCurrent, runMigrations, PROJECT_MIGRATIONS } from './migrate-project';
export type { MigrationStep, Migrated, RawObject } from './migrate-project';
export { findJsonSyntaxProblem } from './json-syntax';
export type { JsonSyntaxProblem } from './json-syntax';
export { contentChecksum, checkAndStrip, INTEGRITY_KEY } from './checksum';
export type { ChecksumCheck, ProjectIntegrity } from './checksum';
