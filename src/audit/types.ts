import type { StructureFacts } from '../chem/facts.js';

export type Severity = 'error' | 'warning' | 'note';

export interface Finding {
  /** Check id (kebab-case), e.g. 'form-matches-structure'. */
  check: string;
  /** Stable message id within the check, e.g. 'racemate-needs-chiral'. Tests assert these, not wording. */
  messageId: string;
  severity: Severity;
  /** Rendered message: what was declared, what was computed, what the chemist can do. */
  message: string;
  /** The data the message template was filled with (declared/computed values). */
  data: Record<string, string | number | boolean | null>;
  /** 1-based line in the record file (or bulk input), null when the finding has no single line. */
  line: number | null;
  /** Record field the finding is about, e.g. 'stereo.form'. */
  field: string | null;
  /**
   * Set when a waiver in the record accepts this finding: why, who, and what the waiver covers in words
   * ("every finding of rotation-consistent" for a waiver that names only the check; absent in results written
   * before it existed).
   */
  waived: { reason: string; approvedBy: string; covers?: string } | null;
  /** The certain correction, when the structure decides it (the pull request shows it as a suggested change). */
  fix?: Fix;
}

/**
 * A certain correction of one record field: in the value of `field`, the text `from` becomes `to` (`from` may be
 * the whole value). Only for claims the drawn structure decides (descriptors, form words, the (+)/(−) sign
 * against the rotation); never for measured values (ee, ratio, rotation).
 */
export interface Fix {
  field: string;
  from: string;
  to: string;
}

/** One check that passed, for the checklist (ticked items). */
export interface PassedCheck {
  check: string;
  /** Short evidence, e.g. "structure is chiral (2 defined stereocentres)". */
  evidence: string;
}

/** One check that did not run on a record, and why (never reported as passed). */
export interface NotRunCheck {
  check: string;
  /** Why, in words: "the structure could not be read (see structure-readable)". */
  reason: string;
}

export interface RecordResult {
  id: string | null;
  file: string;
  /** null when the structure could not be read. */
  computed: StructureFacts | null;
  findings: Finding[];
  passed: PassedCheck[];
  /** Checks that did not run on this record, with the reason (absent in results written before it existed). */
  notRun?: NotRunCheck[];
  /**
   * Checks that do not apply to this record (no ratio declared, no rotation, no origin), with the reason: shown
   * only on request (text --verbose), never as passed. Not in the JSON report.
   */
  notApplicable?: NotRunCheck[];
  declared: { form: string | null; descriptors: string | null };
}

export interface AuditSummary {
  records: number;
  errors: number;
  warnings: number;
  notes: number;
  /** Findings accepted by waivers (not counted above). */
  waived: number;
}

export interface AuditResult {
  tool: { name: 'stereogate'; version: string };
  records: RecordResult[];
  summary: AuditSummary;
  /** The caution printed once in every report. */
  caution: string;
  /** Paths asked for that named no record file, folder or molfile (runAudit only). */
  unmatched?: string[];
  /** The registry-wide phase: whether it ran, and the pairs it found (listed once, here). */
  registry?: RegistrySummary;
}

/** What the registry-wide checks (duplicates, enantiomer pairs) did over the whole run. */
export interface RegistrySummary {
  status: 'run' | 'not-run';
  /** Why it did not run (one shard of a split run), or what it compared. */
  reason: string;
  /** Records whose keys were in the index (in a review: the records under review). */
  records: number;
  /** In a review: the records of the registry those under review were compared with; absent in a full audit. */
  comparedWith?: number;
  /** Identical records and enantiomer pairs, each once (earlier record first). */
  pairs: {
    relation: 'identical' | 'enantiomers';
    first: { id: string | null; file: string };
    second: { id: string | null; file: string };
  }[];
}
