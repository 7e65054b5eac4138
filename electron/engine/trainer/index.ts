/** The synchronizing trainer's engine: levels, exercises, the live model and the verdict of a close. */
export {
  TRAINER_LEVELS,
  findLevel,
  DEFAULT_TRAINER_WINDOW,
  DEFAULT_TRAINER_MACHINE,
  DEFAULT_TRAINER_BUS,
  MACHINE_STANDARD_WINDOW,
  DEAD_BUS_CLOSE_LIMITS,
} from './levels';
export { startExercise } from './exercise';
export { stepTrainer, breakerActualMs, busFrequencyAt, governorDroopPU, SPEED_RAISE_HZ_PER_S, VOLTAGE_RAISE_PU_PER_S, MAX_FRAME_S } from './live-model';
export { contactStress, busReactanceOnMachineBasePU } from './contact-stress';
export type { ContactStress } from './contact-stress';
export { afterCloseTraces } from './after-close';
export type { AfterCloseOptions } from './after-close';
export { judgeClose } from './verdict';
export { judgePass, faultWords } from './pass';
export { afterClosePlantTraces } from './after-close-plant';
export { seededRandom } from './random';
export { trainerMachineFromPlant } from './from-plant';
