/** Running totals of a bulk audit, shared by a single run and by the merge of shard outputs (same numbers). */
import { CAUTION } from '../audit/caution.js';
import type { AuditSummary } from '../audit/types.js';
import { VERSION } from '../audit/version.js';
import type { StereoForm } from '../registry/types.js';
import type { BulkRecordResult } from './audit-item.js';
import { VocabularyTally } from './mapping.js';
import type { BulkTrailer } from './writers.js';

export class BulkAccumulator {
  readonly summary: AuditSummary = { records: 0, errors: 0, warnings: 0, notes: 0, waived: 0 };
  private readonly byCheck: BulkTrailer['byCheck'] = {};
  private readonly tally = new VocabularyTally();

  add(r: BulkRecordResult): void {
    this.summary.records++;
    for (const f of r.findings) {
      const c = (this.byCheck[f.check] ??= { error: 0, warning: 0, note: 0, waived: 0 });
      if (f.waived) {
        this.summary.waived++;
        c.waived++;
      } else {
        c[f.severity]++;
        if (f.severity === 'error') this.summary.errors++;
        else if (f.severity === 'warning') this.summary.warnings++;
        else this.summary.notes++;
      }
    }
    if (r.form_word.word) {
      this.tally.add(r.form_word.word, { form: (r.declared.form as StereoForm | null) ?? null, how: r.form_word.how });
    }
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
