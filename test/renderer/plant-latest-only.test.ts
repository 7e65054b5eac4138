import { describe, it, expect } from 'vitest';
import { latestOnly } from '../../renderer/stores/latest-only';

const ticks = async (n: number) => {
  for (let i = 0; i < n; i++) await Promise.resolve();
};

describe('latestOnly', () => {
  it('runs one job at a time and keeps only the newest waiting input', async () => {
    const gates: (() => void)[] = [];
    const ran: number[] = [];
    const r = latestOnly(async (x: number) => {
      ran.push(x);
      await new Promise<void>((go) => gates.push(go));
    });
    void r.push(1);
    void r.push(2);
    void r.push(3);
    expect(r.busy).toBe(true);
    expect(ran).toEqual([1]);
    gates.shift()?.();
    await ticks(5);
    expect(ran).toEqual([1, 3]);
    gates.shift()?.();
    await r.settled();
    expect(r.busy).toBe(false);
    expect(ran).toEqual([1, 3]);
  });

  it('never loses an input pushed just as the last job ends (any microtask delay)', async () => {
    for (let delay = 0; delay < 12; delay++) {
      const ran: number[] = [];
      const r = latestOnly(async (x: number) => {
        ran.push(x);
      });
      void r.push(1);
      await ticks(delay);
      void r.push(2);
      await r.settled();
      await r.settled();
      expect(ran.at(-1), `push after ${delay} microtasks`).toBe(2);
    }
  });

  it('keeps serving after a job throws', async () => {
    const ran: number[] = [];
    const r = latestOnly(async (x: number) => {
      ran.push(x);
      if (x === 1) throw new Error('engine said no');
    });
    await r.push(1);
    await r.push(2);
    expect(ran).toEqual([1, 2]);
  });
});
