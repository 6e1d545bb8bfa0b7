/** Running totals of a bulk audit, shared by a single run and by the merge of shard outputs (same numbers). */
import { CAUTION } from '../audit/caution.js';
import type { AuditSummary } from '../audit/types.js';
import { VERSION } from '../audit/version.js';
import type { StereoForm } from '../registry/types.js';
import { VocabularyTally } from './mapping.js';
import type { Tally } from './render-record.js';
import type { BulkTrailer } from './writers.js';

export class BulkAccumulator {
  readonly summary: AuditSummary = { records: 0, errors: 0, warnings: 0, notes: 0, waived: 0 };
  private readonly byCheck: BulkTrailer['byCheck'] = {};
  private readonly tally = new VocabularyTally();

  add(t: Tally): void {
    this.summary.records++;
    for (const [check, severity, waived] of t.findings) {
      const c = (this.byCheck[check] ??= { error: 0, warning: 0, note: 0, waived: 0 });
      if (waived) {
        this.summary.waived++;
        c.waived++;
      } else {
        c[severity]++;
        if (severity === 'error') this.summary.errors++;
        else if (severity === 'warning') this.summary.warnings++;
        else this.summary.notes++;
      }
    }
    if (t.word) this.tally.add(t.word, { form: (t.form as StereoForm | null) ?? null, how: t.how });
  }

  trailer(shard: string | null): BulkTrailer {
    return {
      kind: 'summary',
      summary: { ...this.summary },
      byCheck: Object.fromEntries(Object.entries(this.byCheck).sort((a, b) => (a[0] < b[0] ? -1 : 1))),
      vocabulary: this.tally.toJSON(),
      caution: CAUTION,
      tool: { name: 'stereogate', version: VERSION },
      shard,
    };
  }
}
