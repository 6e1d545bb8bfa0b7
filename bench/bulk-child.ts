/**
 * One measured bulk run, in a process of its own so the parent (bench/bulk.ts) can pin it to a set of CPUs
 * (`taskset`) and read its own resource usage: `tsx bench/bulk-child.ts <csv> <workers>` prints one JSON line with
 * the records, wall and CPU seconds (all threads), peak resident memory, and the wall-clock time at every 1% of
 * the records (for the steady-state rate, after the per-worker JIT warm-up).
 */
import { DEFAULT_CONFIG } from '../src/audit/config.js';
import { runBulkAudit } from '../src/bulk/run.js';

export interface ChildResult {
  workers: number;
  records: number;
  seconds: number;
  cpuSeconds: number;
  peakMiB: number;
  /** [records done, seconds since start] at every 1% of the input. */
  marks: [number, number][];
}

async function main(): Promise<void> {
  const [csv, w, total] = process.argv.slice(2);
  const workers = Number(w);
  const step = Math.max(1, Math.floor(Number(total) / 100));
  const marks: [number, number][] = [];
  let done = 0;
  const t0 = performance.now();
  const run = await runBulkAudit({
    inputs: [csv],
    mapping: {},
    config: { ...DEFAULT_CONFIG },
    workers,
    progress: 'none',
    writers: [],
    onRecord: () => {
      done++;
      if (done % step === 0) marks.push([done, (performance.now() - t0) / 1000]);
    },
  });
  const seconds = (performance.now() - t0) / 1000;
  const usage = process.resourceUsage();
  const result: ChildResult = {
    workers,
    records: run.trailer.summary.records,
    seconds,
    cpuSeconds: (usage.userCPUTime + usage.systemCPUTime) / 1e6,
    peakMiB: usage.maxRSS / 1024,
    marks,
  };
  process.stdout.write(JSON.stringify(result) + '\n');
}

void main();
