import { describe, expect, it } from 'vitest';
import { mapOrdered } from '../../src/bulk/pool.js';

const script = new URL('./workers/echo-worker.ts', import.meta.url);
const base = { script, timeoutMs: 1500, onTimeout: () => -999, onCrash: () => -555 };

async function collect<T>(it: AsyncIterable<T>): Promise<T[]> {
  const out: T[] = [];
  for await (const x of it) out.push(x);
  return out;
}

describe('ordered worker pool', () => {
  it('returns results in input order across two workers', async () => {
    const input = Array.from({ length: 500 }, (_, i) => i);
    const out = await collect(mapOrdered(input, { ...base, workers: 2, batchSize: 7 }));
    expect(out).toEqual(input.map((n) => n * n));
  });

  it('gives a stalled item its timeout result, replaces the worker and finishes the rest', async () => {
    const input = [1, 2, 3, -1, 4, 5, 6, 7, 8, 9, 10];
    const out = await collect(mapOrdered(input, { ...base, workers: 2, batchSize: 3 }));
    expect(out).toEqual([1, 4, 9, -999, 16, 25, 36, 49, 64, 81, 100]);
  });

  it('blames the item the worker is stuck on, not an earlier one of its batch whose result was not sent yet', async () => {
    // one worker, batches of 3: [1, 2, 3] then [4, -1, 5]; 4 is finished (unsent) when -1 stalls
    const input = [1, 2, 3, 4, -1, 5, 6];
    const out = await collect(mapOrdered(input, { ...base, workers: 1, batchSize: 3 }));
    expect(out).toEqual([1, 4, 9, 16, -999, 25, 36]);
  });

  it('gives a crashing item its crash result and keeps going', async () => {
    const input = [2, -2, 3, 4];
    const out = await collect(mapOrdered(input, { ...base, workers: 1, batchSize: 2 }));
    expect(out).toEqual([4, -555, 9, 16]);
  });

  it('streams from an async source with a bounded window', async () => {
    let maxAhead = 0;
    let read = 0;
    let yielded = 0;
    async function* source() {
      for (let i = 0; i < 2000; i++) {
        read++;
        maxAhead = Math.max(maxAhead, read - yielded);
        yield i;
      }
    }
    for await (const v of mapOrdered(source(), { ...base, workers: 2, batchSize: 8, window: 64 })) {
      expect(v).toBe(yielded * yielded);
      yielded++;
    }
    expect(yielded).toBe(2000);
    expect(maxAhead).toBeLessThanOrEqual(64 + 8 * 2 * 2 + 1);
  });

  it('keeps two batches with each worker, so it never waits for the main thread between batches', async () => {
    let inFlight = 0;
    const input = Array.from({ length: 400 }, (_, i) => i);
    const out = await collect(
      mapOrdered(input, { ...base, workers: 1, batchSize: 4, onStats: (s) => (inFlight = s.maxInFlight) }),
    );
    expect(out).toEqual(input.map((n) => n * n));
    expect(inFlight).toBe(8);
  });

  it('runs inline when no workers are asked for', async () => {
    const out = await collect(mapOrdered([1, 2, 3], { ...base, workers: 0, inline: (n: number) => n + 1 }));
    expect(out).toEqual([2, 3, 4]);
  });
});

describe('worker heap limit (issue 10: one 15 MB SMILES cell reached 4 GB)', () => {
  it('a worker over its heap limit dies alone: its item gets the crash result, the rest go on', async () => {
    const input = [2, -3, 3];
    const errors: string[] = [];
    const out = await collect(
      mapOrdered(input, {
        ...base,
        timeoutMs: 30_000,
        workers: 1,
        batchSize: 1,
        resourceLimits: { maxOldGenerationSizeMb: 48, maxYoungGenerationSizeMb: 8 },
        onCrash: (_item, _i, error) => {
          errors.push(error);
          return -555;
        },
      }),
    );
    expect(out).toEqual([4, -555, 9]);
    expect(errors[0]).toMatch(/memory/i);
  });
});
