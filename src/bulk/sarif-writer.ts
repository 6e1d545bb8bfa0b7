/**
 * SARIF 2.1.0 for bulk runs, streamed: the header (tool, rules) first, one result per finding as records come,
 * the run properties last. Results are built by the audit's own SARIF code (report/sarif.ts), one record at a
 * time, so a bulk log and a record-file log look alike.
 */
import { createWriteStream } from 'node:fs';
import type { CheckModule } from '../checks/types.js';
import { NotRunTally } from '../report/not-run.js';
import { sarifInvocations, sarifLog } from '../report/sarif.js';
import type { RenderedRecord } from './render-record.js';
import { close, drainWrite, type BulkTrailer, type RecordWriter } from './writers.js';

export const TIME_LIMIT_RULE = {
  id: 'record-time-limit',
  defaultSeverity: 'error' as const,
  summary: 'A bulk record whose audit exceeded the per-record time limit or crashed its worker',
  explanation:
    'The bulk audit gives each record a time limit so that one pathological structure cannot stall a run; such a ' +
    'record is reported instead of audited and the worker is replaced. Audit it on its own with a longer limit.',
};

/** The rules of a bulk SARIF log: the checks, then the time-limit rule (workers render with the same list). */
export function bulkSarifRules(checks: readonly CheckModule[]): CheckModule[] {
  return [...checks, TIME_LIMIT_RULE as unknown as CheckModule];
}

export function sarifWriter(
  path: string,
  checks: readonly CheckModule[],
  tool: { name: 'stereogate'; version: string },
  caution: string,
): RecordWriter {
  const s = createWriteStream(path, 'utf8');
  const none = { records: 0, errors: 0, warnings: 0, notes: 0, waived: 0 };
  const header = sarifLog({ tool, records: [], summary: none, caution }, bulkSarifRules(checks));
  const run = (header.runs as Record<string, unknown>[])[0];
  const head = JSON.stringify({ ...header, runs: [{ tool: run.tool, results: ['\u0000'] }] });
  const [before, after] = head.split('"\\u0000"');
  const ruleIndex = new Map(
    ((run.tool as { driver: { rules: { id: string }[] } }).driver.rules ?? []).map((r, i) => [r.id, i]),
  );
  const notRun = new NotRunTally();
  let first = true;
  let started = false;
  return {
    needs: 'sarif',
    async write(r: RenderedRecord) {
      if (!started) {
        started = true;
        await drainWrite(s, before);
      }
      if (r.notRun) notRun.add(r.notRun.ref, r.notRun.checks);
      for (const res of r.sarif ?? []) {
        await drainWrite(s, (first ? '' : ',') + res);
        first = false;
      }
    },
    async finish(t: BulkTrailer) {
      if (!started) await drainWrite(s, before);
      const invocations = sarifInvocations(notRun.list(), ruleIndex);
      const tail = after.replace(
        /\}\]\}$/,
        (invocations ? `,"invocations":${JSON.stringify(invocations)}` : '') +
          `,"properties":${JSON.stringify({ caution: t.caution, summary: t.summary })}}]}`,
      );
      await drainWrite(s, tail + '\n');
      await close(s);
    },
  };
}
