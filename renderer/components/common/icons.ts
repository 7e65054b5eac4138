/** The paths of Droopline's small line icons (see Icon.vue). */

/** Icon names. */
export type IconName =
  | 'left'
  | 'right'
  | 'up'
  | 'down'
  | 'copy'
  | 'remove'
  | 'plus'
  | 'overload'
  | 'reverse'
  | 'max'
  | 'min'
  | 'under'
  | 'offline'
  | 'ok'
  | 'warn'
  | 'stop'
  | 'undo'
  | 'redo';

/** Stroke paths per icon (viewBox 0 0 16 16). */
export const PATHS: Record<IconName, string> = {
  left: 'M10 3 L5 8 L10 13',
  right: 'M6 3 L11 8 L6 13',
  up: 'M3 10 L8 5 L13 10',
  down: 'M3 6 L8 11 L13 6',
  copy: 'M5.5 5.5 H13 V13 H5.5 Z M3 10.5 V3 H10.5',
  remove: 'M4 4 L12 12 M12 4 L4 12',
  plus: 'M8 3 V13 M3 8 H13',
  overload: 'M8 2.5 L14 13.5 H2 Z M8 6.5 V10 M8 11.6 V12',
  reverse: 'M13 8 H3.5 M7 4.5 L3.5 8 L7 11.5',
  max: 'M3 3 H13 M8 14 V6 M5 9 L8 6 L11 9',
  min: 'M3 13 H13 M8 2 V10 M5 7 L8 10 L11 7',
  under: 'M8 2.5 A5.5 5.5 0 1 0 8 13.5 Z M8 2.5 A5.5 5.5 0 0 1 8 13.5',
  offline: 'M8 2.5 A5.5 5.5 0 1 0 8.01 2.5 Z',
  ok: 'M3 8.5 L6.5 12 L13 4.5',
  warn: 'M8 2.5 L14 13.5 H2 Z M8 6.5 V10 M8 11.6 V12',
  stop: 'M5.5 2.5 H10.5 L13.5 5.5 V10.5 L10.5 13.5 H5.5 L2.5 10.5 V5.5 Z M5.5 8 H10.5',
  undo: 'M6 3.5 L2.5 7 L6 10.5 M2.5 7 H10 A3.5 3.5 0 0 1 10 14 H7',
  redo: 'M10 3.5 L13.5 7 L10 10.5 M13.5 7 H6 A3.5 3.5 0 0 0 6 14 H9',
};
export const FILLED: ReadonlySet<IconName> = new Set(['under']);
