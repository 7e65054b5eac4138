/**
 * A request queue of length one: at most one job runs, and while it runs only the
 * newest waiting input is kept. Edits and a dragged slider fire faster than the engine
 * answers; this runs the job for the latest input as soon as the engine is free and
 * never spends time on inputs that are already out of date.
 */

/** A coalescing runner over an async job. */
export interface LatestOnly<T> {
  /** Runs the job for `input` now, or as soon as the running job ends (replacing any older waiting input). */
  push(input: T): Promise<void>;
  /** Resolves when no job is running and none is waiting. */
  settled(): Promise<void>;
  /** True while a job runs. */
  readonly busy: boolean;
}

/**
 * Creates a runner over `job`. A job that throws is the job's own business: the runner
 * swallows the rejection so one failure never blocks later inputs (jobs record their errors).
 */
export function latestOnly<T>(job: (input: T) => Promise<void>): LatestOnly<T> {
  let running: Promise<void> | null = null;
  let waiting: { input: T } | null = null;

  async function drain(first: T): Promise<void> {
    let current: { input: T } | null = { input: first };
    while (current) {
      try {
        await job(current.input);
      } catch {
        // The job reports its own failures; keep serving newer inputs.
      }
      current = waiting;
      waiting = null;
    }
    // Cleared in the same step as the last look at `waiting`: a push arriving after
    // this line starts a new drain instead of waiting for one that has ended.
    running = null;
  }

  return {
    push(input: T): Promise<void> {
      if (running) {
        waiting = { input };
        return running;
      }
      running = drain(input);
      return running;
    },
    settled(): Promise<void> {
      return running ?? Promise.resolve();
    },
    get busy() {
      return running !== null;
    },
  };
}
