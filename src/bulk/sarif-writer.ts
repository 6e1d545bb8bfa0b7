/**
 * SARIF 2.1.0 for bulk runs, streamed: the header (tool, rules) first, one result per finding as records come,
 * the run properties last. Results are built by the audit's own SARIF code (report/sarif.ts), one record at a
 * time, so a bulk log and a record-file log look alike.
 */
import { createWriteStream } from 'node:fs';
import type { CheckModule } from '../checks/types.js';
import { sarifLog } from '../report/sarif.js';
import type { BulkRecordResult } from './audit-item.js';
import type { BulkTrailer, RecordWriter } from './writers.js';

export const TIME_LIMIT_RULE = {
  id: 'record-time-limit',
  defaultSeverity: 'error' as const,
  summary: 'A bulk record whose audit exceeded the per-record time limit or crashed its worker',
  explanation:
    'The bulk audit gives each record a time limit so that one pathological structure cannot stall a run; such a ' +
    'record is reported instead of audited and the worker is replaced. Audit it on its own with a longer limit.',
};

export function sarifWriter(path: string, checks: readonly CheckModule[], tool: { name: 'stereogate'; version: string }, caution: string): RecordWriter {
  const s = createWriteStream(path, 'utf8');
  const allChecks = [...checks, TIME_LIMIT_RULE as unknown as CheckModule];
  const header = sarifLog({ tool, records: [], summary: { records: 0, errors: 0, warnings: 0, notes: 0, waived: 0 }, caution }, allChecks);
  const run = (header.runs as Record<string, unknown>[])[0];
  const rules = ((run.tool as { driver: { rules: { id: string }[] } }).driver.rules);
  const index = new Map(rules.map((r, i) => [r.id, i]));
  const head = JSON.stringify({ ...header, runs: [{ tool: run.tool, results: ['\u0000'] }] });
  const [before, after] = head.split('"\\u0000"');
  let first = true;
  let started = false;
  const write = (t: string) => (s.write(t) ? Promise.resolve() : new Promise<void>((res) => s.once('drain', () => res())));
  return {
    async write(r: BulkRecordResult) {
      if (!started) {
        started = true;
        await write(before);
      }
      const one = sarifLog({ tool, records: [r], summary: { records: 1, errors: 0, warnings: 0, notes: 0, waived: 0 }, caution }, allChecks);
      const results = (one.runs as { results: Record<string, unknown>[] }[])[0].results;
      for (const res of results) {
        res.ruleIndex = index.get(res.ruleId as string);
        (res.properties as Record<string, unknown>).record = r.origin.record;
        await write((first ? '' : ',') + JSON.stringify(res));
        first = false;
      }
    },
    async finish(t: BulkTrailer) {
      if (!started) await write(before);
      const tail = after.replace(/\}\]\}$/, `,"properties":${JSON.stringify({ caution: t.caution, summary: t.summary })}}]}`);
      await write(tail + '\n');
      await new Promise<void>((res) => s.end(() => res()));
    },
  };
}
