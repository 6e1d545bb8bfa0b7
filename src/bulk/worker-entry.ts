/**
 * Worker side of the ordered pool (pool.ts): receive a batch, run the handler on each item, send the batch's
 * results back in one message. Per-item progress goes through shared memory (the index of the item being worked
 * on, and a count of items finished), which the pool watches for its time limit.
 */
import { parentPort, workerData } from 'node:worker_threads';
import type { PoolWorkerData } from './pool.js';

export function serveWorker<I, O>(handler: (item: I, data: unknown) => O | Promise<O>): void {
  const port = parentPort;
  if (!port) throw new Error('serveWorker must run inside a worker thread');
  const { user, progress: shared } = workerData as PoolWorkerData;
  const progress = new Int32Array(shared);
  let chain = Promise.resolve();
  port.on('message', (msg: { jobs: { index: number; item: I }[] }) => {
    chain = chain.then(async () => {
      const results: [number, O][] = [];
      for (const job of msg.jobs) {
        Atomics.store(progress, 0, job.index);
        results.push([job.index, await handler(job.item, user)]);
        Atomics.add(progress, 1, 1);
      }
      Atomics.store(progress, 0, -1);
      port.postMessage({ results });
    });
  });
  port.postMessage({ ready: true });
}
