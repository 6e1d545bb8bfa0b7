/**
 * The cooperative time and memory budget (src/chem/budget.ts): checkBudget() throws BudgetExceeded once the
 * deadline has passed or the heap grew past the bound; nothing happens without an active budget; nested budgets
 * keep the tighter one and restore the outer one.
 */
import { describe, expect, it } from 'vitest';
import { BudgetExceeded, budgetActive, checkBudget, withBudget } from '../../src/chem/budget.js';

const spin = (ms: number): void => {
  const end = Date.now() + ms;
  while (Date.now() < end) checkBudget();
};

describe('budget', () => {
  it('does nothing without an active budget', () => {
    expect(budgetActive()).toBe(false);
    expect(() => spin(5)).not.toThrow();
  });

  it('throws BudgetExceeded (kind time) after the deadline, with the limit and the label', () => {
    let caught: unknown = null;
    try {
      withBudget({ timeMs: 20, memoryMb: 1024 }, 'record LX-00001', () => spin(2000));
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(BudgetExceeded);
    expect((caught as BudgetExceeded).kind).toBe('time');
    expect((caught as BudgetExceeded).limit).toBe(20);
    expect((caught as BudgetExceeded).message).toContain('record LX-00001');
    expect(budgetActive()).toBe(false);
  });

  it('returns the value when the work fits', () => {
    expect(withBudget({ timeMs: 10_000, memoryMb: 1024 }, 'x', () => 42)).toBe(42);
  });

  it('a nested budget keeps the tighter deadline and restores the outer one', () => {
    withBudget({ timeMs: 10_000, memoryMb: 1024 }, 'outer', () => {
      expect(() => withBudget({ timeMs: 10, memoryMb: 1024 }, 'inner', () => spin(2000))).toThrow(
        BudgetExceeded,
      );
      expect(budgetActive()).toBe(true);
      expect(() => spin(20)).not.toThrow();
    });
  });

  it('throws BudgetExceeded (kind memory) when the heap grows past the bound', () => {
    const hoard: Float64Array[] = [];
    let caught: unknown = null;
    try {
      withBudget({ timeMs: 60_000, memoryMb: 8 }, 'record LX-00002', () => {
        for (let i = 0; i < 4000; i++) {
          hoard.push(new Float64Array(8192).fill(i)); // 64 KB each, kept alive: 250 MB if never stopped
          checkBudget(64);
        }
      });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(BudgetExceeded);
    expect((caught as BudgetExceeded).kind).toBe('memory');
    expect(hoard.length).toBeLessThan(4000);
  });
});
