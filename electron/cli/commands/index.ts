/** Every CLI sub-command. Add a command by adding its module here. */
import type { CliCommand } from '../io';
import { describeCommand } from './describe';
import { reportCommand } from './report';
import { simulateCommand } from './simulate';
import { solveCommand } from './solve';
import { syncCommand } from './sync';

export const commands: CliCommand[] = [describeCommand, reportCommand, simulateCommand, solveCommand, syncCommand];
