/**
 * An ordered worker-thread pool for the bulk audit.
 *
 * - Items stream in (any AsyncIterable); results stream out IN INPUT ORDER whatever the scheduling.
 * - At most `window` items are in flight or buffered, so memory stays flat whatever the input size.
 * - Items go to workers in batches (fewer messages); a worker reports each item as it finishes it, so a stall is
 *   noticed per item: when a worker makes no progress for `timeoutMs`, its current item gets `onTimeout(item)`
 *   as its result, the worker is terminated and replaced, and the rest of its batch is handed out again.
 * - `workers: 0` runs the handler in this thread (no timeout protection; for tests and tiny inputs).
 */
import { Worker } from 'node:worker_threads';

export interface PoolOptions<I, O> {
  workers: number;
  /** Worker entry (a module calling `serveWorker` from ./worker-entry.js). */
  script: URL;
  /** Extra Node flags for workers. A `.ts` script is loaded through tsx automatically (tests, `npm run demo`). */
  execArgv?: string[];
  /** Passed once to every worker (e.g. the audit config). Must be structured-cloneable. */
  workerData?: unknown;
  /** No progress on an item for this long -> it times out and the worker is replaced. */
  timeoutMs: number;
  onTimeout: (item: I, index: number) => O;
  /** A worker that dies (crash, out of memory) -> its current item gets this result. */
  onCrash?: (item: I, index: number, error: string) => O;
  /** In-process fallback used when workers is 0. */
  inline?: (item: I) => O;
  batchSize?: number;
  window?: number;
}

interface Job<I> {
  index: number;
  item: I;
}

interface Slot<I> {
  worker: Worker;
  queue: Job<I>[]; // items sent to it, not yet reported
  lastProgress: number;
  dead: boolean;
}

type Reply = { index: number; result: unknown } | { ready: true };

export async function* mapOrdered<I, O>(items: AsyncIterable<I> | Iterable<I>, opts: PoolOptions<I, O>): AsyncGenerator<O> {
  if (opts.workers <= 0) {
    if (!opts.inline) throw new Error('mapOrdered: workers=0 needs an inline handler');
    for await (const item of items) yield opts.inline(item);
    return;
  }
  const batchSize = Math.max(1, opts.batchSize ?? 16);
  const window = Math.max(batchSize * opts.workers * 2, opts.window ?? batchSize * opts.workers * 4);
  const iterator = (Symbol.asyncIterator in items ? (items as AsyncIterable<I>)[Symbol.asyncIterator]() : toAsync(items as Iterable<I>));

  const done = new Map<number, O>();
  const pending: Job<I>[] = []; // read from input, not yet sent to a worker
  let nextIndex = 0; // next input index to read
  let nextOut = 0; // next index to yield
  let inputDone = false;
  let wake: (() => void) | null = null;
  let failure: Error | null = null;
  const notify = () => {
    const w = wake;
    wake = null;
    if (w) w();
  };

  const slots: Slot<I>[] = [];
  const spawn = (): Slot<I> => {
    const worker = startWorker(opts.script, opts.execArgv, opts.workerData);
    const slot: Slot<I> = { worker, queue: [], lastProgress: Date.now(), dead: false };
    worker.on('message', (msg: Reply) => {
      if ('ready' in msg) return;
      slot.lastProgress = Date.now();
      const at = slot.queue.findIndex((j) => j.index === msg.index);
      if (at >= 0) slot.queue.splice(at, 1);
      done.set(msg.index, msg.result as O);
      notify();
    });
    worker.on('error', (err) => {
      if (slot.dead) return;
      slot.dead = true;
      const [current, ...rest] = slot.queue;
      slot.queue = [];
      if (current) {
        const result = opts.onCrash
          ? opts.onCrash(current.item, current.index, String(err?.message ?? err))
          : opts.onTimeout(current.item, current.index);
        done.set(current.index, result);
      }
      pending.unshift(...rest);
      replace(slot);
      notify();
    });
    worker.on('exit', () => {
      if (!slot.dead && slot.queue.length > 0) worker.emit('error', new Error('worker exited'));
    });
    return slot;
  };
  const replace = (slot: Slot<I>) => {
    const i = slots.indexOf(slot);
    void slot.worker.terminate();
    if (i >= 0) slots[i] = spawn();
  };
  for (let i = 0; i < opts.workers; i++) slots.push(spawn());

  const timer = setInterval(() => {
    const now = Date.now();
    for (const slot of slots) {
      if (slot.dead || slot.queue.length === 0) continue;
      if (now - slot.lastProgress > opts.timeoutMs) {
        slot.dead = true;
        const [current, ...rest] = slot.queue;
        slot.queue = [];
        done.set(current.index, opts.onTimeout(current.item, current.index));
        pending.unshift(...rest);
        replace(slot);
        notify();
      }
    }
  }, Math.max(20, Math.min(1000, Math.floor(opts.timeoutMs / 4))));
  timer.unref();

  const readMore = async () => {
    while (!inputDone && nextIndex - nextOut < window && pending.length < batchSize * opts.workers * 2) {
      const r = await iterator.next();
      if (r.done) {
        inputDone = true;
        break;
      }
      pending.push({ index: nextIndex++, item: r.value });
    }
  };
  const dispatch = () => {
    for (const slot of slots) {
      if (slot.dead || slot.queue.length >= batchSize || pending.length === 0) continue;
      const batch = pending.splice(0, batchSize - slot.queue.length);
      if (slot.queue.length === 0) slot.lastProgress = Date.now();
      slot.queue.push(...batch);
      slot.worker.postMessage({ jobs: batch });
    }
  };

  try {
    for (;;) {
      if (failure) throw failure;
      await readMore();
      dispatch();
      while (done.has(nextOut)) {
        const value = done.get(nextOut) as O;
        done.delete(nextOut);
        nextOut++;
        yield value;
      }
      if (inputDone && nextOut >= nextIndex) break;
      await new Promise<void>((resolve) => {
        wake = resolve;
        // pending work and free slots: go round again without waiting
        if (done.has(nextOut) || (pending.length > 0 && slots.some((s) => !s.dead && s.queue.length < batchSize))) notify();
      });
    }
  } catch (e) {
    failure = e as Error;
    throw e;
  } finally {
    clearInterval(timer);
    await Promise.all(slots.map((s) => s.worker.terminate()));
  }
}

/** Start a worker; TypeScript entries are loaded through tsx's loader, registered inside the worker. */
function startWorker(script: URL, execArgv: string[] | undefined, data: unknown): Worker {
  if (!script.pathname.endsWith('.ts')) return new Worker(script, { execArgv, workerData: data });
  const tsx = import.meta.resolve('tsx/esm/api');
  const code =
    `import(${JSON.stringify(tsx)}).then((m) => { m.register(); return import(${JSON.stringify(script.href)}); })` +
    `.catch((e) => { setImmediate(() => { throw e; }); });`;
  return new Worker(code, { eval: true, execArgv, workerData: data });
}

async function* toAsync<I>(items: Iterable<I>): AsyncGenerator<I> {
  for (const item of items) yield item;
}
