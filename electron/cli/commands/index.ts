/** Every CLI sub-command. Add a command by adding its module here. */
import type { CliCommand } from '../io';
import { describeCommand } from './describe';
import { reportCommand } from './report';
import { solveCommand } from './solve';
import { syncCommand } from './sync';

export const commands: CliCommand[] = [describeCommand, reportCommand, solveCommand, syncCommand];
