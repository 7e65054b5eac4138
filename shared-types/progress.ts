/** Progress of a long engine job (closing map, simulation), pushed to the caller. */
export interface ProgressEvent {
  /** Request id the progress belongs to. */
  id: number;
  /** 0..1 */
  fraction: number;
  label?: string;
}
