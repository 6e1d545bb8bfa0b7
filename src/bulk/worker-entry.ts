/**
 * Worker side of the ordered pool (pool.ts): receive batches, run the handler on each item, report each result
 * as soon as it is ready (the pool watches per-item progress for its time limit).
 */
import { parentPort, workerData } from 'node:worker_threads';

export function serveWorker<I, O>(handler: (item: I, data: unknown) => O | Promise<O>): void {
  const port = parentPort;
  if (!port) throw new Error('serveWorker must run inside a worker thread');
  let chain = Promise.resolve();
  port.on('message', (msg: { jobs: { index: number; item: I }[] }) => {
    chain = chain.then(async () => {
      for (const job of msg.jobs) {
        const result = await handler(job.item, workerData);
        port.postMessage({ index: job.index, result });
      }
    });
  });
  port.postMessage({ ready: true });
}
