// Test worker: squares numbers, spins forever on -1 (a stand-in for a pathological structure), crashes on -2.
import { serveWorker } from '../../../src/bulk/worker-entry.js';

serveWorker<number, number>((n) => {
  if (n === -1)
    for (;;) {
      /* stall */
    }
  if (n === -2) process.exit(3);
  return n * n;
});
