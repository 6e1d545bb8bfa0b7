/**
 * A time and memory budget for one piece of work (one record of an audit), checked cooperatively: long loops of
 * the engine call `checkBudget()`, which throws `BudgetExceeded` once the deadline has passed or the heap has
 * grown by more than the bound since the work began. The caller that set the budget (`withBudget`) turns that
 * into a finding for that record, and the run goes on. Pure apart from reading the clock and the heap size;
 * without an active budget `checkBudget()` costs a counter increment.
 *
 * The same mechanism serves the record audit (main thread) and the bulk workers: a worker stops a hopeless
 * record itself instead of being terminated and replaced by the pool (the pool's time limit stays the backstop).
 */
import { getHeapStatistics } from 'node:v8';

export interface Budget {
  /** Wall-clock milliseconds the work may take. */
  timeMs: number;
  /** Megabytes the heap may grow by while the work runs (garbage included until it is collected). */
  memoryMb: number;
}

/** The budget ran out: `kind` says which bound, `limit` its value (ms or MB), `label` the work it was set for. */
export class BudgetExceeded extends Error {
  constructor(
    readonly kind: 'time' | 'memory',
    readonly limit: number,
    readonly label: string,
  ) {
    super(
      kind === 'time'
        ? `${label} took longer than its time limit of ${limit / 1000} s`
        : `${label} needed more than its memory bound of ${limit} MB`,
    );
    this.name = 'BudgetExceeded';
  }
}

interface Active {
  deadline: number;
  heapLimit: number;
  budget: Budget;
  label: string;
}

/** JavaScript heap in use plus the memory held outside it by typed arrays (which the engine uses a lot). */
function heapBytes(): number {
  const h = getHeapStatistics();
  return h.used_heap_size + h.external_memory;
}

let active: Active | null = null;
/** Work counted since the clock and the heap were last read. */
let sinceClock = 0;
let sinceHeap = 0;

/** Clock reads are cheap, heap reads less so: the clock every 64 units of work, the heap every 1024. */
const CLOCK_EVERY = 64;
const HEAP_EVERY = 1024;

/**
 * Runs `fn` under `budget`. Nested budgets keep the tighter deadline and heap bound; the outer one is restored
 * afterwards. Throws BudgetExceeded out of `fn` when a check inside it finds the budget spent.
 */
export function withBudget<T>(budget: Budget, label: string, fn: () => T): T {
  const outer = active;
  const deadline = Date.now() + budget.timeMs;
  const heapLimit = heapBytes() + budget.memoryMb * 2 ** 20;
  const tighter = outer !== null && outer.deadline <= deadline;
  active = {
    deadline: tighter ? outer.deadline : deadline,
    heapLimit: outer ? Math.min(outer.heapLimit, heapLimit) : heapLimit,
    budget: tighter ? outer.budget : budget,
    label: outer?.label ?? label,
  };
  try {
    return fn();
  } finally {
    active = outer;
  }
}

/**
 * Throws BudgetExceeded when the active budget is spent; does nothing without one. Call it in long loops;
 * `work` weighs one call (e.g. the number of group elements a step goes through), so that coarse steps read the
 * clock as often as fine ones.
 */
export function checkBudget(work = 1): void {
  if (active === null) return;
  sinceClock += work;
  sinceHeap += work;
  if (sinceClock >= CLOCK_EVERY) {
    sinceClock = 0;
    if (Date.now() > active.deadline) throw new BudgetExceeded('time', active.budget.timeMs, active.label);
  }
  if (sinceHeap >= HEAP_EVERY) {
    sinceHeap = 0;
    if (heapBytes() > active.heapLimit) {
      throw new BudgetExceeded('memory', active.budget.memoryMb, active.label);
    }
  }
}

/** Whether a budget is active (for tests and for code that chooses a cheaper path under one). */
export function budgetActive(): boolean {
  return active !== null;
}
