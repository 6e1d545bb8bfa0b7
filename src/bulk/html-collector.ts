/**
 * Collects flagged records of a bulk run (up to a cap) and writes the self-contained HTML report at the end,
 * with a depiction of each (our CIP labels at the atoms; depicted in the main thread only for the flagged records
 * kept, so the audit itself pays nothing for it).
 */
import { writeFileSync } from 'node:fs';
import { readStructure } from '../chem/read/index.js';
import { depict } from '../chem/depict.js';
import { renderHtmlPage, type HtmlRow } from '../report/html/render.js';
import type { HtmlEntry, RenderedRecord } from './render-record.js';
import type { BulkTrailer, RecordWriter } from './writers.js';

export class HtmlCollector implements RecordWriter {
  readonly needs = 'html' as const;
  private readonly kept: HtmlEntry[] = [];
  flaggedCount = 0;

  constructor(
    readonly path: string,
    private readonly maxRecords = 20_000,
    private readonly maxDepictions = 2_000,
  ) {}

  async write(r: RenderedRecord): Promise<void> {
    if (!r.html) return;
    this.flaggedCount++;
    if (this.kept.length < this.maxRecords) this.kept.push(r.html);
  }

  async finish(t: BulkTrailer): Promise<void> {
    const rows: (HtmlRow & { svg: string | null })[] = this.kept.map((e, i) => ({
      ...e.row,
      svg: i < this.maxDepictions ? drawing(e, i) : null,
    }));
    const notes = [
      `${t.summary.records} records audited${t.shard ? ` (shard ${t.shard})` : ''}; ${this.flaggedCount} flagged.`,
    ];
    if (this.flaggedCount > this.kept.length)
      notes.push(
        `Only the first ${this.kept.length} flagged records are listed; see the JSON output for all.`,
      );
    if (this.kept.length > this.maxDepictions)
      notes.push(`Depictions are drawn for the first ${this.maxDepictions} flagged records.`);
    for (const [w, e] of t.vocabulary.mapped)
      notes.push(`legacy form word "${w}" read as ${e.form} (${e.count} records)`);
    for (const [w, n] of t.vocabulary.notUnderstood)
      notes.push(`form word "${w}" not understood (${n} records; audited as unknown)`);
    const page = renderHtmlPage(rows, {
      tool: t.tool,
      caution: t.caution,
      summary: t.summary,
      byCheck: t.byCheck,
      flaggedTotal: this.flaggedCount,
      notes,
      title: 'stereogate bulk audit',
    });
    writeFileSync(this.path, page);
  }
}

/** The depiction of a kept record with our CIP labels at the atoms, or null when it cannot be drawn. */
function drawing(e: HtmlEntry, i: number): string | null {
  if (!e.structure) return null;
  const read = readStructure(e.structure, { format: e.structure.includes('\n') ? 'molfile' : 'smiles' });
  if (!read.ok) return null;
  return depict(
    read.structure,
    e.labels.map((l) => ({ atom: l.atom - 1, text: l.text })),
    { id: `d${i}` },
  );
}
