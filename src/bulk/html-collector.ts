/**
 * Collects flagged records of a bulk run (up to a cap) and writes the self-contained HTML report at the end,
 * with a depiction of each (our CIP labels at the atoms; depicted in the main thread only for the flagged records
 * kept, so the audit itself pays nothing for it).
 */
import { writeFileSync } from 'node:fs';
import { readStructure } from '../chem/read/index.js';
import { depict } from '../chem/depict.js';
import type { AuditResult } from '../audit/types.js';
import { renderHtml } from '../report/html/render.js';
import type { BulkRecordResult } from './audit-item.js';
import type { BulkTrailer, RecordWriter } from './writers.js';

export class HtmlCollector implements RecordWriter {
  private readonly kept: BulkRecordResult[] = [];
  flaggedCount = 0;

  constructor(
    readonly path: string,
    private readonly maxRecords = 20_000,
    private readonly maxDepictions = 2_000,
  ) {}

  async write(r: BulkRecordResult): Promise<void> {
    if (!r.findings.some((f) => !f.waived)) return;
    this.flaggedCount++;
    if (this.kept.length < this.maxRecords) this.kept.push(r);
  }

  async finish(t: BulkTrailer): Promise<void> {
    const depictions = new Map<number, string>();
    this.kept.slice(0, this.maxDepictions).forEach((r, i) => {
      if (!r.structure_text) return;
      const read = readStructure(r.structure_text, { format: r.structure_text.includes('\n') ? 'molfile' : 'smiles' });
      if (!read.ok) return;
      const labels = (r.computed?.units ?? [])
        .filter((u) => u.label)
        .flatMap((u) => u.atoms.map((a) => ({ atom: a - 1, text: u.label as string })));
      const svg = depict(read.structure, labels, { id: `d${i}` });
      if (svg) depictions.set(i, svg);
    });
    const result: AuditResult = { tool: t.tool, caution: t.caution, summary: t.summary, records: this.kept };
    const notes = [
      `${t.summary.records} records audited${t.shard ? ` (shard ${t.shard})` : ''}; ${this.flaggedCount} flagged.`,
    ];
    if (this.flaggedCount > this.kept.length) notes.push(`Only the first ${this.kept.length} flagged records are listed; see the JSON output for all.`);
    if (this.kept.length > this.maxDepictions) notes.push(`Depictions are drawn for the first ${this.maxDepictions} flagged records.`);
    for (const [w, e] of t.vocabulary.mapped) notes.push(`legacy form word "${w}" read as ${e.form} (${e.count} records)`);
    for (const [w, n] of t.vocabulary.notUnderstood) notes.push(`form word "${w}" not understood (${n} records; audited as unknown)`);
    writeFileSync(this.path, renderHtml(result, { depictions, notes, title: 'stereogate bulk audit' }));
  }
}
