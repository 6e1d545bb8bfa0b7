/**
 * The contract between the audit and the check modules. A check is data: one module per file, exporting a
 * `CheckModule`; src/checks/index.ts lists them. Adding a check never means editing a switch elsewhere.
 */
import type { StructureFacts, RelationFacts } from '../chem/facts.js';
import type { Structure } from '../chem/types.js';
import type { CompoundRecord, LoadedRecord } from '../registry/types.js';
import type { Finding, Fix, Severity } from '../audit/types.js';

/** Tolerances and thresholds; every one configurable (schema/config.schema.json), defaults in src/audit/config.ts. */
export interface AuditConfig {
  /** Where record files live, relative to the registry root. */
  recordDirs: string[];
  /** Per-check severity overrides, or 'off'. */
  severities: Record<string, Severity | 'off'>;
  /** Parts of a ratio must sum to 100 within this many percentage points. */
  ratioSumTolerance: number;
  /** A racemate's enantiomer ratio may deviate from 50:50 by this many percentage points. */
  racemateRatioTolerance: number;
  /** Stated ee and ee computed from a ratio may differ by this many percentage points. */
  eeTolerance: number;
  /** A single-enantiomer claim needs at least this ee (percent). */
  singleEnantiomerMinEe: number;
  /** |specific rotation| at or below this (degrees) counts as zero. */
  zeroRotationTolerance: number;
  /**
   * A biaryl bond with at least this many ortho substituents (both rings together) is a potential stereogenic
   * axis when the structure does not draw one (a rule of thumb; the engine's perception reads it).
   */
  axisOrthoMin: number;
}

/** The structure of one record, read and described (or the reason it could not be). */
export interface ReadStructure {
  structure: Structure | null;
  facts: StructureFacts | null;
  /** Why reading failed, with where (line/offset) when known. */
  error: {
    message: string;
    line: number | null;
    offset: number | null;
    /** The reader's error code when there is one ('smiles-too-long', 'too-many-atoms', ...). */
    code?: string;
  } | null;
}

/** A record of the registry as the cross-record checks see it. */
export interface RegistryEntry {
  id: string | null;
  file: string;
  record: CompoundRecord;
  main: ReadStructure;
  /** True for records being audited now (changed in the pull request / named on the command line). */
  underReview: boolean;
}

/**
 * The registry as a per-record check may see it (lookups by id, e.g. the inputs of an origin block). The
 * registry-wide comparisons (duplicates, enantiomers) do not go through it: they run over the key index
 * (src/audit/registry-phase.ts).
 */
export interface RegistryView {
  /** Every record of the registry (in a worker of the streamed audit: read on first use). */
  readonly entries: readonly RegistryEntry[];
  /**
   * Why this view does not hold the whole registry (a bulk run that audits each record on its own, one shard of
   * a sharded run), or null/absent when it does. Checks that need the registry are then reported as not run.
   */
  incomplete?: string | null;
  /** The entry with this id, without reading every record when the view can (a streamed audit's worker). */
  byId?(id: string): RegistryEntry | undefined;
  /** The ids of `entries`, in order, without reading every record when the view can (a streamed audit's worker, a review over an index). */
  ids?(): readonly string[];
}

/** The engine functions a check may call (so checks stay pure and testable). */
export interface EngineApi {
  relate(a: Structure, b: Structure): RelationFacts;
}

export interface CheckContext {
  loaded: LoadedRecord;
  /** Null when the record failed the schema (only the structure/schema checks run then). */
  record: CompoundRecord | null;
  main: ReadStructure;
  /** `stereo.components`, read and described, in record order. */
  components: ReadStructure[];
  registry: RegistryView;
  config: AuditConfig;
  engine: EngineApi;
  /**
   * Findings of the checks that ran before this one on the same record (in CHECKS order), with severity, line
   * and `waived` already set by the audit. A check listed last (e.g. the waiver check) sees all the others.
   */
  findings?: readonly Finding[];
}

/** What a check reports before the audit adds severity overrides, positions and waivers. */
export interface RawFinding {
  messageId: string;
  data: Record<string, string | number | boolean | null>;
  /** Record field the finding is about ('stereo.form', 'stereo.ratio', …); the audit turns it into a line. */
  field: string | null;
  /** Overrides the check's default severity for this message (e.g. a note-level message in a warning check). */
  severity?: Severity;
  /** The certain correction, when there is one (src/audit/types.ts, Fix). */
  fix?: Fix;
}

export interface CheckOutcome {
  findings: RawFinding[];
  /** When the check applied and found nothing: short evidence for the ticked checklist item. */
  passed?: string;
  /**
   * When the check does not apply to this record, why (e.g. 'no rotation given (stereo.rotation)'): omitted
   * from the checklist, listed as not applicable with --verbose; never passed.
   */
  notApplicable?: string;
  /** When the check applies but could not run (an input it needs is missing): the reason, shown as not run. */
  notRun?: string;
}

/** What a check needs before it can run; without it the audit reports the check as not run, with the reason. */
export type CheckRequirement = 'structure' | 'registry';

export interface CheckModule {
  /** kebab-case, our own, self-explanatory. */
  id: string;
  defaultSeverity: Severity;
  /** One line. */
  summary: string;
  /** The chemistry, with its source (IUPAC section, paper, handbook, or "common practice, no source"). */
  explanation: string;
  /** Message templates by message id; `{name}` placeholders are filled from RawFinding.data. */
  messages: Record<string, string>;
  /** Inputs the check needs: the record's structure read and described; the whole registry. */
  requires?: readonly CheckRequirement[];
  /**
   * 'registry': a registry-wide check; the per-record audit skips it and the registry-wide phase
   * (src/audit/registry-phase.ts) runs it over the index of every record's keys. Default 'record'.
   */
  scope?: 'record' | 'registry';
  run(ctx: CheckContext): CheckOutcome;
}
