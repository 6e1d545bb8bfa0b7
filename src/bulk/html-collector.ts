/**
 * Collects flagged records of a bulk run (up to a cap) and writes the self-contained HTML report at the end,
 * with the 2D layout of each for its depiction (laid out in the main thread only for the flagged records kept,
 * so the audit itself pays nothing for it). A molfile record keeps its own coordinates (cheap, always drawn); a
 * computed layout costs about 12 ms (npm run bench -- outputs), so only the first `maxLayouts` get one; the cards of
 * the others say why they have no picture.
 */
import { writeFileSync } from 'node:fs';
import { readStructure } from '../chem/read/index.js';
import { layoutStructure } from '../chem/depict.js';
import type { Structure } from '../chem/types.js';
import { renderHtmlPage, type HtmlRow } from '../report/html/render.js';
import { pictureData, type PicData } from '../report/html/picture.js';
import { plural } from '../report/checklist.js';
import { NotRunTally } from '../report/not-run.js';
import type { HtmlEntry, RenderedRecord } from './render-record.js';
import type { BulkTrailer, RecordWriter } from './writers.js';

export class HtmlCollector implements RecordWriter {
  readonly needs = 'html' as const;
  private readonly kept: HtmlEntry[] = [];
  private readonly notRun = new NotRunTally();
  flaggedCount = 0;

  constructor(
    readonly path: string,
    private readonly maxRecords = 20_000,
    private readonly maxLayouts = 3_000,
  ) {}

  async write(r: RenderedRecord): Promise<void> {
    if (r.notRun) this.notRun.add(r.notRun.ref, r.notRun.checks);
    if (!r.html) return;
    this.flaggedCount++;
    if (this.kept.length < this.maxRecords) this.kept.push(r.html);
  }

  async finish(t: BulkTrailer): Promise<void> {
    let computed = 0;
    let skipped = 0;
    const bound = this.maxLayouts.toLocaleString('en-US');
    const rows: (HtmlRow & { pic: PicData | null })[] = this.kept.map((e) => {
      const read = readKept(e);
      if (!read) return { ...e.row, pic: null, noPicture: 'the structure could not be read' };
      if (read.dimension !== 2 && computed >= this.maxLayouts) {
        skipped++;
        const noPicture =
          `layouts are computed for the first ${plural(bound, 'flagged record')} given as SMILES only ` +
          '(molfile records are always drawn)';
        return { ...e.row, pic: null, noPicture };
      }
      const layout = layoutStructure(read);
      if (layout?.origin === 'computed') computed++;
      return layout
        ? { ...e.row, pic: pictureData(layout, e.units) }
        : { ...e.row, pic: null, noPicture: 'no 2D layout could be computed for this structure' };
    });
    const notes = [
      `${t.summary.records} records audited${t.shard ? ` (shard ${t.shard})` : ''}; ${this.flaggedCount} flagged.`,
    ];
    if (this.flaggedCount > this.kept.length)
      notes.push(
        `Only the first ${this.kept.length} flagged records are listed; see the JSON output for all.`,
      );
    if (skipped > 0)
      notes.push(
        `${plural(skipped, 'flagged record')} from SMILES ${skipped === 1 ? 'has' : 'have'} no depiction: layouts are computed for the first ${bound} (molfile records are always drawn as registered); their cards say so.`,
      );
    for (const [w, e] of t.vocabulary.mapped)
      notes.push(`legacy form word "${w}" read as ${e.form} (${plural(e.count, 'record')})`);
    for (const [w, n] of t.vocabulary.notUnderstood)
      notes.push(`form word "${w}" not understood (${plural(n, 'record')}; audited as unknown)`);
    const page = renderHtmlPage(rows, {
      tool: t.tool,
      caution: t.caution,
      summary: t.summary,
      byCheck: t.byCheck,
      flaggedTotal: this.flaggedCount,
      notRun: this.notRun.list(),
      notes,
      title: 'stereogate bulk audit',
    });
    writeFileSync(this.path, page);
  }
}

/** The structure of a kept record, read again (the worker sent its text), or null when it cannot be read. */
function readKept(e: HtmlEntry): Structure | null {
  if (!e.structure) return null;
  const read = readStructure(e.structure, { format: e.structure.includes('\n') ? 'molfile' : 'smiles' });
  return read.ok ? read.structure : null;
}
