/** The error every project-reading failure throws: a sentence for the user and its kind. */
import type { FieldIssue } from '../../shared-types';
import { EngineError } from '../engine';

/** Why a project file could not be read. */
export type ProjectFileProblem = 'empty' | 'binary' | 'truncated' | 'corrupted' | 'not-a-project' | 'foreign' | 'newer' | 'invalid';

/**
 * A project file that cannot be opened. The message says what is wrong, where, and that
 * the file was left as it is; `issues` lists field problems for `invalid` files.
 */
export class ProjectFileError extends EngineError {
  readonly problem: ProjectFileProblem;
  readonly issues: FieldIssue[];
  constructor(problem: ProjectFileProblem, message: string, issues: FieldIssue[] = []) {
    super('INVALID_INPUT', message);
    this.problem = problem;
    this.issues = issues;
  }
}
