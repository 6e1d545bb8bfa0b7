/**
 * An ordered worker-thread pool for the bulk audit.
 *
 * - Items stream in (any AsyncIterable); results stream out IN INPUT ORDER whatever the scheduling.
 * - At most `window` items are in flight or buffered, so memory stays flat whatever the input size. Each worker
 *   holds up to two batches, so it never waits for the main thread between batches.
 * - Items go to workers in batches and come back in batches (few messages: a message costs far more than a
 *   small result). Progress is reported per item through shared memory instead (the index of the item being
 *   worked on, and a count of items finished), so a stall is still noticed per item: when a worker makes no
 *   progress for `timeoutMs`, the item it is stuck on gets `onTimeout(item)` as its result, the worker is
 *   terminated and replaced, and the rest of its batch (finished results not yet sent included) is handed out
 *   again.
 * - `workers: 0` runs the handler in this thread (no timeout protection; for tests and tiny inputs).
 */
import { Worker, type ResourceLimits } from 'node:worker_threads';

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
  /** V8 heap limits of each worker (a worker over them dies with ERR_WORKER_OUT_OF_MEMORY: `onCrash`). */
  resourceLimits?: ResourceLimits;
  /** In-process fallback used when workers is 0. */
  inline?: (item: I) => O;
  batchSize?: number;
  window?: number;
  /** Called once at the end with the pool's accounting (what bounds memory). */
  onStats?: (stats: PoolStats) => void;
}

/** High-water marks of the pool: items read but not yet yielded, results waiting for their turn, unsent items. */
export interface PoolStats {
  window: number;
  maxAhead: number;
  maxBuffered: number;
  maxPending: number;
  /** Most items one worker held at once (sent, not yet reported): two batches when it is kept busy. */
  maxInFlight: number;
  items: number;
  replaced: number;
}

interface Job<I> {
  index: number;
  item: I;
}

interface Slot<I> {
  worker: Worker;
  /** Shared with the worker: [index of the item being worked on or -1, items finished so far]. */
  progress: Int32Array;
  seen: number;
  queue: Job<I>[]; // items sent to it, not yet reported
  lastProgress: number;
  dead: boolean;
  /** The worker has loaded its code; the time limit runs only from then (start-up can be slow under load). */
  ready: boolean;
  started: number;
}

/** A worker that has not loaded its code after this long is treated as stalled. */
const STARTUP_LIMIT_MS = 120_000;

type Reply = { results: [index: number, result: unknown][] } | { ready: true };

/** What a pool worker gets as workerData (worker-entry.ts unpacks it). */
export interface PoolWorkerData {
  user: unknown;
  progress: SharedArrayBuffer;
}

export async function* mapOrdered<I, O>(
  items: AsyncIterable<I> | Iterable<I>,
  opts: PoolOptions<I, O>,
): AsyncGenerator<O> {
  if (opts.workers <= 0) {
    if (!opts.inline) throw new Error('mapOrdered: workers=0 needs an inline handler');
    let n = 0;
    for await (const item of items) {
      n++;
      yield opts.inline(item);
    }
    opts.onStats?.({
      window: 1,
      maxAhead: 1,
      maxBuffered: 0,
      maxPending: 0,
      maxInFlight: 1,
      items: n,
      replaced: 0,
    });
    return;
  }
  const batchSize = Math.max(1, opts.batchSize ?? 16);
  const window = Math.max(batchSize * opts.workers * 2, opts.window ?? batchSize * opts.workers * 4);
  const iterator =
    Symbol.asyncIterator in items
      ? (items as AsyncIterable<I>)[Symbol.asyncIterator]()
      : toAsync(items as Iterable<I>);

  const done = new Map<number, O>();
  const stats: PoolStats = {
    window,
    maxAhead: 0,
    maxBuffered: 0,
    maxPending: 0,
    maxInFlight: 0,
    items: 0,
    replaced: 0,
  };
  const record = (at: number, result: O) => {
    done.set(at, result);
    if (done.size > stats.maxBuffered) stats.maxBuffered = done.size;
  };
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
    const shared = new SharedArrayBuffer(8);
    const progress = new Int32Array(shared);
    progress[0] = -1;
    const data: PoolWorkerData = { user: opts.workerData, progress: shared };
    const worker = startWorker(opts.script, opts.execArgv, data, opts.resourceLimits);
    const slot: Slot<I> = {
      worker,
      progress,
      seen: 0,
      queue: [],
      lastProgress: Date.now(),
      dead: false,
      ready: false,
      started: Date.now(),
    };
    worker.on('message', (msg: Reply) => {
      if ('ready' in msg) {
        slot.ready = true;
        slot.lastProgress = Date.now();
        return;
      }
      if (slot.dead) return;
      slot.lastProgress = Date.now();
      const finished = new Set<number>();
      for (const [index, result] of msg.results) {
        finished.add(index);
        record(index, result as O);
      }
      slot.queue = slot.queue.filter((j) => !finished.has(j.index));
      notify();
    });
    worker.on('error', (err) => {
      if (slot.dead) return;
      slot.dead = true;
      const [current, rest] = takeCurrent(slot);
      if (current) {
        const result = opts.onCrash
          ? opts.onCrash(current.item, current.index, String(err?.message ?? err))
          : opts.onTimeout(current.item, current.index);
        record(current.index, result);
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
  /** The item a dead or stuck worker was on (from shared memory), and the rest of its queue to hand out again. */
  const takeCurrent = (slot: Slot<I>): [Job<I> | undefined, Job<I>[]] => {
    const on = Atomics.load(slot.progress, 0);
    const at = slot.queue.findIndex((j) => j.index === on);
    const current = at >= 0 ? slot.queue[at] : slot.queue[0];
    const rest = slot.queue.filter((j) => j !== current);
    slot.queue = [];
    return [current, rest];
  };
  const replace = (slot: Slot<I>) => {
    const i = slots.indexOf(slot);
    stats.replaced++;
    void slot.worker.terminate();
    if (i >= 0) slots[i] = spawn();
  };
  for (let i = 0; i < opts.workers; i++) slots.push(spawn());

  const timer = setInterval(
    () => {
      const now = Date.now();
      for (const slot of slots) {
        if (slot.dead || slot.queue.length === 0) continue;
        const finished = Atomics.load(slot.progress, 1);
        if (finished !== slot.seen) {
          slot.seen = finished;
          slot.lastProgress = now;
        }
        const stalled = slot.ready
          ? now - slot.lastProgress > opts.timeoutMs
          : now - slot.started > Math.max(STARTUP_LIMIT_MS, opts.timeoutMs);
        if (stalled) {
          slot.dead = true;
          const [current, rest] = takeCurrent(slot);
          if (current) record(current.index, opts.onTimeout(current.item, current.index));
          pending.unshift(...rest);
          replace(slot);
          notify();
        }
      }
    },
    Math.max(20, Math.min(1000, Math.floor(opts.timeoutMs / 4))),
  );
  timer.unref();

  const canRead = () =>
    !inputDone && nextIndex - nextOut < window && pending.length < batchSize * opts.workers * 2;
  const readMore = async () => {
    while (canRead()) {
      const r = await iterator.next();
      if (r.done) {
        inputDone = true;
        break;
      }
      pending.push({ index: nextIndex++, item: r.value });
      if (nextIndex - nextOut > stats.maxAhead) stats.maxAhead = nextIndex - nextOut;
      if (pending.length > stats.maxPending) stats.maxPending = pending.length;
    }
  };
  // Two batches in flight per worker: it starts the next while the main thread takes the last one's results, so
  // it never waits for a round trip (on a machine whose cores all run workers, that wait is a scheduling slice).
  const inFlight = batchSize * 2;
  const hasRoom = (slot: Slot<I>) => !slot.dead && slot.queue.length <= inFlight - batchSize;
  const dispatch = () => {
    for (const slot of slots) {
      if (!hasRoom(slot) || pending.length === 0) continue;
      const batch = pending.splice(0, batchSize);
      if (slot.queue.length === 0) slot.lastProgress = Date.now();
      slot.queue.push(...batch);
      if (slot.queue.length > stats.maxInFlight) stats.maxInFlight = slot.queue.length;
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
        // a result to yield, room to read more (the window moved while results were yielded), or pending work
        // and free slots: go round again without waiting
        if (done.has(nextOut) || canRead() || (pending.length > 0 && slots.some(hasRoom))) notify();
      });
    }
  } catch (e) {
    failure = e as Error;
    throw e;
  } finally {
    stats.items = nextIndex;
    opts.onStats?.(stats);
    clearInterval(timer);
    await Promise.all(slots.map((s) => s.worker.terminate()));
  }
}

/** Start a worker; TypeScript entries are loaded through tsx's loader, registered inside the worker. */
function startWorker(
  script: URL,
  execArgv: string[] | undefined,
  data: unknown,
  resourceLimits: ResourceLimits | undefined,
): Worker {
  if (!script.pathname.endsWith('.ts'))
    return new Worker(script, { execArgv, workerData: data, resourceLimits });
  const tsx = import.meta.resolve('tsx/esm/api');
  const code =
    `import(${JSON.stringify(tsx)}).then((m) => { m.register(); return import(${JSON.stringify(script.href)}); })` +
    `.catch((e) => { setImmediate(() => { throw e; }); });`;
  return new Worker(code, { eval: true, execArgv, workerData: data, resourceLimits });
}

async function* toAsync<I>(items: Iterable<I>): AsyncGenerator<I> {
  for (const item of items) yield item;
}
