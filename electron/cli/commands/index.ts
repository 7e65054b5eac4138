/** Every CLI sub-command. Add a command by adding its module here. */
import type { CliCommand } from '../io';
import { describeCommand } from './describe';
import { fitCommand } from './fit';
import { planCommand } from './plan';
import { reportCommand } from './report';
import { simulateCommand } from './simulate';
import { solveCommand } from './solve';
import { syncCommand } from './sync';
import { toleranceCommand } from './tolerance';

export const commands: CliCommand[] = [describeCommand, fitCommand, planCommand, reportCommand, simulateCommand, solveCommand, syncCommand, toleranceCommand];
