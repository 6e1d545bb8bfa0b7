import { performance } from 'node:perf_hooks';

export interface Timing {
  label: string;
  items: number;
  seconds: number;
  perSecond: number;
}

export function time<T>(label: string, items: number, fn: () => T): { timing: Timing; value: T } {
  const t0 = performance.now();
  const value = fn();
  const seconds = (performance.now() - t0) / 1000;
  return { timing: { label, items, seconds, perSecond: items / seconds }, value };
}

export async function timeAsync<T>(
  label: string,
  items: number,
  fn: () => Promise<T>,
): Promise<{ timing: Timing; value: T }> {
  const t0 = performance.now();
  const value = await fn();
  const seconds = (performance.now() - t0) / 1000;
  return { timing: { label, items, seconds, perSecond: items / seconds }, value };
}

export function fmt(t: Timing): string {
  return `${t.label.padEnd(52)} ${String(t.items).padStart(7)} items  ${t.seconds.toFixed(2).padStart(7)} s  ${t.perSecond
    .toFixed(0)
    .padStart(7)} /s`;
}

export function ratioLine(what: string, ours: Timing, base: Timing, target?: number): string {
  const r = ours.perSecond / base.perSecond;
  const verdict =
    target === undefined
      ? ''
      : r >= target
        ? `  (target >= ${target}x: met)`
        : `  (target >= ${target}x: NOT met)`;
  return `${what}: ${r.toFixed(1)}x the baseline${verdict}`;
}
