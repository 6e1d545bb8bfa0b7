/**
 * How a legacy export maps onto our record: which SD data field or CSV column holds each claim, and how the
 * export's own words for stereo forms map onto ours. Unknown words are never guessed: they are reported as
 * not understood and the record's form becomes `unknown` with a finding.
 */
import type { StereoForm } from '../registry/types.js';
import { STEREO_FORMS } from '../registry/types.js';

export interface BulkMapping {
  /** Field/column with the registry id. When absent: the SD title line, else `<file>#<record>`. */
  id?: string;
  /** Field/column with the structure (SMILES, or a molfile block in a CSV cell). SD files: the molfile itself. */
  structure?: string;
  name?: string;
  form?: string;
  descriptors?: string;
  ratio?: string;
  ee?: string;
  rotation?: string;
  /**
   * Column with the inputs the compound was made from (registered ids within the export, or SMILES), separated by
   * ';' or ','. Read only when mapped: the run then looks the named ids up in the export first.
   */
  origin?: string;
  /** Column with the origin's stereocontrol (none, chiral-catalyst, …); default 'origin_control' when origin is mapped. */
  control?: string;
  /** Legacy word -> our form, added to (and overriding) the built-in vocabulary. Matched case-insensitively. */
  vocabulary?: Record<string, StereoForm>;
}

/** Default column names tried when the mapping leaves one out (case-insensitive). */
export const DEFAULT_COLUMNS: Required<Omit<BulkMapping, 'vocabulary' | 'origin' | 'control'>> = {
  id: 'id',
  structure: 'smiles',
  name: 'name',
  form: 'stereo_form',
  descriptors: 'descriptors',
  ratio: 'ratio',
  ee: 'ee',
  rotation: 'rotation',
};

/** The control column read when an origin column is mapped and no control column is. */
export const DEFAULT_CONTROL_COLUMN = 'origin_control';

/**
 * Words legacy registries use for stereo forms. Common practice, no source: collected from the way chemists
 * abbreviate on labels and in notebooks; extend per registry with `vocabulary` in the config.
 */
const BUILT_IN: Record<string, StereoForm> = {
  rac: 'racemate',
  racemic: 'racemate',
  racemate: 'racemate',
  '(+/-)': 'racemate',
  '+/-': 'racemate',
  '(±)': 'racemate',
  '±': 'racemate',
  dl: 'racemate',
  meso: 'meso',
  achiral: 'achiral',
  'no stereo': 'achiral',
  'not chiral': 'achiral',
  'single enantiomer': 'single-enantiomer',
  enantiopure: 'single-enantiomer',
  'enantiomerically pure': 'single-enantiomer',
  homochiral: 'single-enantiomer',
  abs: 'single-enantiomer',
  absolute: 'single-enantiomer',
  enantioenriched: 'enantioenriched',
  scalemic: 'enantioenriched',
  enriched: 'enantioenriched',
  'single diastereomer': 'single-diastereomer',
  diastereomer: 'single-diastereomer',
  'diastereomerically pure': 'single-diastereomer',
  'diastereomer mixture': 'diastereomer-mixture',
  'mixture of diastereomers': 'diastereomer-mixture',
  dr: 'diastereomer-mixture',
  unknown: 'unknown',
  undefined: 'unknown',
  unk: 'unknown',
  '?': 'unknown',
};

export interface VocabularyResult {
  form: StereoForm | null;
  /** How the word was understood: our own word, a mapped legacy word, or not at all. */
  how: 'ours' | 'mapped' | 'not-understood' | 'empty';
}

function normalise(word: string): string {
  return word
    .trim()
    .toLowerCase()
    .replace(/[_\s]+/g, ' ')
    .replace(/\s*-\s*(?=[a-z])/g, ' ');
}

export function makeVocabulary(
  extra: Record<string, StereoForm> = {},
): (word: string | undefined) => VocabularyResult {
  const table = new Map<string, StereoForm>();
  for (const [k, v] of Object.entries(BUILT_IN)) table.set(normalise(k), v);
  for (const [k, v] of Object.entries(extra)) table.set(normalise(k), v);
  const ours = new Set<string>(STEREO_FORMS);
  return (word) => {
    if (word === undefined || word.trim() === '') return { form: null, how: 'empty' };
    const trimmed = word.trim();
    if (ours.has(trimmed)) return { form: trimmed as StereoForm, how: 'ours' };
    const hit = table.get(normalise(trimmed)) ?? table.get(normalise(trimmed.replace(/^\((.*)\)$/, '$1')));
    if (hit) return { form: hit, how: 'mapped' };
    return { form: null, how: 'not-understood' };
  };
}

/** Distinct not-understood words kept by name; the rest are counted under OTHER_WORDS. */
export const MAX_WORDS = 1000;
export const OTHER_WORDS = '(other words)';

/** Tally of the form words seen in a bulk input, for the end-of-run report. */
export class VocabularyTally {
  readonly mapped = new Map<string, { form: StereoForm; count: number }>();
  readonly notUnderstood = new Map<string, number>();

  add(word: string, result: VocabularyResult): void {
    if (result.how === 'mapped' && result.form) {
      const e = this.mapped.get(word) ?? { form: result.form, count: 0 };
      e.count++;
      this.mapped.set(word, e);
    } else if (result.how === 'not-understood') {
      // a free-text column must not fill the memory: past MAX_WORDS distinct words, the rest are counted together
      const key = this.notUnderstood.has(word) || this.notUnderstood.size < MAX_WORDS ? word : OTHER_WORDS;
      this.notUnderstood.set(key, (this.notUnderstood.get(key) ?? 0) + 1);
    }
  }

  merge(other: {
    mapped: [string, { form: StereoForm; count: number }][];
    notUnderstood: [string, number][];
  }): void {
    for (const [w, e] of other.mapped) {
      const mine = this.mapped.get(w) ?? { form: e.form, count: 0 };
      mine.count += e.count;
      this.mapped.set(w, mine);
    }
    for (const [w, n] of other.notUnderstood) {
      const key = this.notUnderstood.has(w) || this.notUnderstood.size < MAX_WORDS ? w : OTHER_WORDS;
      this.notUnderstood.set(key, (this.notUnderstood.get(key) ?? 0) + n);
    }
  }

  toJSON(): { mapped: [string, { form: StereoForm; count: number }][]; notUnderstood: [string, number][] } {
    const byWord = <T>(a: [string, T], b: [string, T]) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0);
    return { mapped: [...this.mapped].sort(byWord), notUnderstood: [...this.notUnderstood].sort(byWord) };
  }
}
