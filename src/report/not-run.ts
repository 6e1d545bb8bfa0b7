/**
 * Checks that did not run, gathered over a run for the reports that show a whole run at once (the HTML page and
 * the SARIF log): one group per check and reason, with how many records and the first few of them. Gathered as
 * records pass, so a bulk run keeps only the groups, never every record.
 */
import type { NotRunCheck } from '../audit/types.js';
import { plural } from './checklist.js';

/** Records named in a group (the rest are counted). */
export const NOT_RUN_EXAMPLES = 10;

export interface NotRunRecordRef {
  id: string | null;
  /** The record file (or, in a bulk run, the export). */
  file: string;
  /** The record's line in the export (bulk runs), null for record files. */
  line: number | null;
}

export interface NotRunGroup {
  check: string;
  reason: string;
  records: number;
  /** The first NOT_RUN_EXAMPLES records, in the run's order. */
  examples: NotRunRecordRef[];
}

export class NotRunTally {
  private readonly groups = new Map<string, NotRunGroup>();

  add(record: NotRunRecordRef, notRun: readonly NotRunCheck[] | undefined): void {
    for (const n of notRun ?? []) {
      const key = `${n.check}\u0000${n.reason}`;
      let g = this.groups.get(key);
      if (!g) this.groups.set(key, (g = { check: n.check, reason: n.reason, records: 0, examples: [] }));
      g.records++;
      if (g.examples.length < NOT_RUN_EXAMPLES) g.examples.push(record);
    }
  }

  /** The groups in the order first seen. */
  list(): NotRunGroup[] {
    return [...this.groups.values()];
  }
}

/** The groups of a run held in memory. */
export function notRunGroups(
  records: readonly { id: string | null; file: string; notRun?: NotRunCheck[] }[],
): NotRunGroup[] {
  const tally = new NotRunTally();
  for (const r of records) tally.add({ id: r.id, file: r.file, line: null }, r.notRun);
  return tally.list();
}

/** "3 records (LX-00001, LX-00002, LX-00003)", naming at most the examples kept and counting the rest. */
export function notRunRecordsText(g: NotRunGroup): string {
  const names = g.examples.map((e) => e.id ?? e.file);
  const more = g.records > names.length ? `, and ${g.records - names.length} more` : '';
  return `${plural(g.records, 'record')} (${names.join(', ')}${more})`;
}
