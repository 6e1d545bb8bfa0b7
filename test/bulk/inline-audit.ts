/** A bulk audit of one export, inline (no workers), read back from its JSON report: what the tests compare. */
import { readFileSync, writeFileSync } from 'node:fs';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { runBulkAudit } from '../../src/bulk/run.js';
import { jsonWriter } from '../../src/bulk/writers.js';

export interface ReportedRecord {
  id: string | null;
  findings: { check: string; message: string; field: string | null }[];
}

/** Writes `text` to `path`, audits it with the default config and returns the run and the reported records. */
export async function auditExport(
  path: string,
  text: string,
): Promise<{ run: Awaited<ReturnType<typeof runBulkAudit>>; records: ReportedRecord[] }> {
  writeFileSync(path, text);
  const json = `${path}.json`;
  const run = await runBulkAudit({
    inputs: [path],
    mapping: {},
    config: { ...DEFAULT_CONFIG },
    workers: 0,
    progress: 'none',
    writers: [jsonWriter(json)],
  });
  const out = JSON.parse(readFileSync(json, 'utf8')) as { records: ReportedRecord[] };
  return { run, records: out.records };
}
