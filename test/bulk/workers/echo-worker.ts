// Test worker: squares numbers, spins forever on -1 (a stand-in for a pathological structure), crashes on -2,
// allocates without end on -3 (a record that would fill the memory).
import { serveWorker } from '../../../src/bulk/worker-entry.js';

serveWorker<number, number>((n) => {
  if (n === -1)
    for (;;) {
      /* stall */
    }
  if (n === -2) process.exit(3);
  if (n === -3) {
    const hoard: number[][] = [];
    for (;;) hoard.push(new Array<number>(1 << 16).fill(n));
  }
  return n * n;
});
