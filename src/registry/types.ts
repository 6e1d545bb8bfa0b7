/**
 * A registry record as submitted (our own format, see schema/record.schema.json) plus where each field stood in
 * its source file, so that findings can point at the exact line.
 */

export type StereoForm =
  | 'achiral'
  | 'meso'
  | 'single-enantiomer'
  | 'enantioenriched'
  | 'racemate'
  | 'single-diastereomer'
  | 'diastereomer-mixture'
  | 'unknown';

export const STEREO_FORMS: readonly StereoForm[] = [
  'achiral',
  'meso',
  'single-enantiomer',
  'enantioenriched',
  'racemate',
  'single-diastereomer',
  'diastereomer-mixture',
  'unknown',
];

export interface StructureRef {
  smiles?: string;
  /** Path relative to the record file. */
  molfile?: string;
}

export interface Component {
  smiles?: string;
  molfile?: string;
  descriptors?: string;
}

export interface Rotation {
  value: number;
  wavelength_nm?: number;
  temperature_c?: number;
  solvent?: string;
  concentration?: number;
}

export interface Waiver {
  /** Id of the check whose findings the waiver accepts. */
  check: string;
  /** Narrows it to one message of that check (its message id, e.g. enantiomer-registered). */
  message_id?: string;
  /** Narrows it to findings about this other record (its id, or its file when it has none). */
  other_record?: string;
  reason?: string;
  approved_by?: string;
}

/** What made a synthesis stereoselective or changed the ee (record field origin.control; names ours). */
export type OriginControl =
  | 'none'
  | 'chiral-catalyst'
  | 'chiral-reagent'
  | 'chiral-auxiliary'
  | 'biocatalyst'
  | 'resolution'
  | 'chiral-separation'
  | 'enrichment'
  | 'unknown';

export const ORIGIN_CONTROLS: readonly OriginControl[] = [
  'none',
  'chiral-catalyst',
  'chiral-reagent',
  'chiral-auxiliary',
  'biocatalyst',
  'resolution',
  'chiral-separation',
  'enrichment',
  'unknown',
];

/** How the compound was made: registered ids or SMILES of its inputs, and the stereocontrol, if any. */
export interface Origin {
  from: string[];
  control?: OriginControl;
}

export interface CompoundRecord {
  id: string;
  name?: string;
  structure: StructureRef;
  stereo: {
    form: StereoForm;
    descriptors?: string;
    ee?: number;
    ratio?: string;
    components?: Component[];
    rotation?: Rotation;
    evidence?: string[];
  };
  origin?: Origin;
  waivers?: Waiver[];
}

/** 1-based line (and column) of a field in the record's source file, by JSON-pointer-like path. */
export interface FieldPositions {
  /** e.g. positions.get('stereo.form') -> { line: 7, column: 3 }; 'stereo.components.0.smiles' etc. */
  get(path: string): { line: number; column: number } | undefined;
}

/** A record file after loading: either a record that passed the schema, or the reason it did not. */
export interface LoadedRecord {
  /** Path relative to the registry root, forward slashes. */
  file: string;
  /** The id if one could be read (even from an invalid record), else null. */
  id: string | null;
  record: CompoundRecord | null;
  positions: FieldPositions;
  /**
   * Schema / syntax / registry problems (the audit reports them as 'record-schema' findings). A record that
   * fails the schema has `record` null and only the structure check runs on it.
   */
  problems: {
    message: string;
    path: string;
    line: number | null;
    /** Stable problem id, e.g. 'not-allowed-value', 'unknown-field', 'yaml-syntax', 'duplicate-id'. */
    code?: string;
  }[];
  /** Where this record came from: a record file, or row/record n of a bulk input. */
  origin: { kind: 'file' } | { kind: 'bulk'; source: string; record: number; line: number };
  /**
   * The text of the main structure and of each component, ready for the reader (the loader fetches molfiles,
   * safely, relative to the record file). When absent, the audit takes SMILES straight from `record`.
   */
  sources?: { main: StructureSource | null; components: StructureSource[] };
}

/** Where a structure's text came from, before it is read. */
export interface StructureSource {
  /** Record field holding it: 'structure' or 'stereo.components.0'. */
  field: string;
  format: 'smiles' | 'molfile';
  /** The SMILES or the molfile text; null when the text could not be had (see `error`). */
  text: string | null;
  /** Molfile path relative to the registry root (forward slashes), when it came from a file. */
  file?: string;
  /** Why `text` is null: the path leaves the registry, does not exist, is not UTF-8 text, ... */
  error?: string;
}
