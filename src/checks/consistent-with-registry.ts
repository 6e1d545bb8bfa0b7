/**
 * Check: a record under review against the records already in the registry — the same compound registered
 * again, the enantiomer of a registered compound (with the rotation signs compared), and the same structure
 * registered under a different form.
 */
import type { KeyMatch } from '../registry/key-index.js';
import type { IndexRow } from '../registry/keys.js';
import type { StereoForm } from '../registry/types.js';
import type { AuditConfig, CheckModule, CheckOutcome, RawFinding } from './types.js';
import { conditions } from './rotation-consistent.js';
import { rotationsComparable } from './solvents.js';
import { finding, fmt, plural } from './words.js';

const messages = {
  'already-registered':
    'This structure is identical to {otherId} ({otherFile}{otherName}), already registered as {otherForm}. ' +
    'Register a new batch under {otherId} instead, or, if this is a different substance, correct the structure.',
  'same-structure-different-form':
    'This structure is identical to {otherId} ({otherFile}), but {otherId} is registered as {otherForm} and this ' +
    'record declares {form}. The same drawn structure cannot be both; decide which form is right and correct the ' +
    'other record.',
  'same-structure-other-purity':
    'This structure is identical to {otherId} ({otherFile}), registered as {otherForm}; this record declares ' +
    '{form}. The same enantiomer at another enantiomeric purity: register it as a batch of {otherId} if your SOP ' +
    'allows, or keep it separate on purpose.',
  'enantiomer-registered':
    'This compound is the enantiomer of {otherId} ({otherFile}{otherName}): {explanation}. That is fine if the ' +
    'enantiomer is meant; confirm that the configuration was not drawn inverted by mistake.',
  'enantiomer-rotation-same-sign':
    'This compound and its enantiomer {otherId} have rotations of the same sign ({value}° here, {otherValue}° for ' +
    '{otherId}), measured alike ({conditions}). Enantiomers rotate plane-polarised light by equal amounts in ' +
    'opposite senses, so one structure, one rotation or one record is wrong.',
  'enantiomer-rotation-magnitude':
    'This compound and its enantiomer {otherId} were measured alike ({conditions}) but their rotations differ in ' +
    'size ({value}° vs {otherValue}°). Enantiomers of equal purity have equal and opposite rotations; check the ' +
    'ee of both samples.',
  'enantiomer-rotations-not-compared':
    'The rotations of this compound ({value}°) and of its enantiomer {otherId} ({otherValue}°) were not compared: ' +
    'they were {reason}. Enantiomers measured alike rotate equally in opposite senses; to have the signs checked, ' +
    'record both under the same conditions (or the same spelling of the solvent).',
  'enantiomer-form-conflict':
    'This compound is declared {form}, but its enantiomer {otherId} is registered as {otherForm}. Enantiomers have ' +
    'the same kind of form (both single enantiomers, or both enriched); check both records.',
} as const;

type Id = keyof typeof messages;

/** How the registry-wide phase runs (src/audit/registry-phase.ts). */
export type RegistryMode =
  /**
   * A full audit: records come in the audit's order, each compared with the records before it, so a conflict
   * between two records is reported once, on the later one; enantiomer pairs and duplicates are listed once in
   * the summary, and a record carries only what its owner must act on.
   */
  | 'full'
  /**
   * A review of some records (a pull request) against the whole registry: each record under review is compared
   * with every other record and says what it found, once, itself — a pair of two records under review is said
   * on the one registered later.
   */
  | 'review';

/**
 * Registry order: ids compared with their numbers as numbers (LX-00024 after LX-00008); a record without an
 * id is not registered yet, so it comes after every record with one. Ties fall back to the file path.
 */
export function registeredLater(a: Pick<IndexRow, 'id' | 'file'>, b: Pick<IndexRow, 'id' | 'file'>): boolean {
  if (a.id !== b.id) {
    if (a.id === null) return true;
    if (b.id === null) return false;
    return a.id.localeCompare(b.id, 'en', { numeric: true }) > 0;
  }
  return a.file.localeCompare(b.file, 'en', { numeric: true }) > 0;
}

const ENANTIOPURE: readonly StereoForm[] = ['single-enantiomer', 'enantioenriched'];

/** A pair found by the registry-wide phase, listed once in the summary of a full audit. */
export interface RegistryPair {
  relation: 'identical' | 'enantiomers';
  /** The earlier and the later record (audit order). */
  first: { id: string | null; file: string };
  second: { id: string | null; file: string };
}

export interface RegistryComparison {
  findings: RawFinding[];
  /** Evidence when nothing was found. */
  passed: string;
  pairs: RegistryPair[];
}

/**
 * A record against the records the index found for it (identical ones and enantiomers). `matches` in a full
 * audit are the earlier records only; in a review, every other record (`underReview` tells which of them are
 * under review too).
 */
export function compareWithRegistry(
  me: IndexRow,
  matches: readonly KeyMatch[],
  mode: RegistryMode,
  config: AuditConfig,
  underReview: (row: IndexRow) => boolean = () => false,
): RegistryComparison {
  const out: RawFinding[] = [];
  const pairs: RegistryPair[] = [];
  const form = me.form;
  const ref = (r: IndexRow) => ({ id: r.id, file: r.file });
  const add = (id: Id, other: IndexRow, data: RawFinding['data'], severity?: RawFinding['severity']) => {
    out.push(
      finding(
        id,
        id.startsWith('enantiomer-rotation') ? 'stereo.rotation.value' : 'structure',
        {
          form,
          otherId: other.id ?? other.file,
          otherFile: other.file,
          otherName: other.name ? `, ${other.name}` : '',
          otherForm: other.form,
          ...data,
        },
        severity,
      ),
    );
  };
  let compared = 0;
  for (const { other, relation } of matches) {
    // a pair of two records under review is said once, on the one registered later
    if (mode === 'review' && underReview(other) && !registeredLater(me, other)) continue;
    compared++;
    pairs.push({ relation, first: ref(other), second: ref(me) });
    const otherForm = other.form;
    if (relation === 'identical') {
      if (otherForm === form) add('already-registered', other, {}, 'warning');
      else if (ENANTIOPURE.includes(form) && ENANTIOPURE.includes(otherForm)) {
        add('same-structure-other-purity', other, {}, 'note');
      } else add('same-structure-different-form', other, {});
      continue;
    }
    if (me.keys?.chiral !== true) continue;
    // Registering both enantiomers is normal: a pull request says so once on the new record; a full audit lists
    // the pair in its summary only.
    if (mode === 'review') {
      add(
        'enantiomer-registered',
        other,
        { explanation: 'mirror images that are not superimposable' },
        'note',
      );
    }
    if (ENANTIOPURE.includes(form) !== ENANTIOPURE.includes(otherForm)) {
      add('enantiomer-form-conflict', other, {}, 'warning');
    }
    const a = me.rotation;
    const b = other.rotation;
    const tol = config.zeroRotationTolerance;
    const alike = a && b ? rotationsComparable(a, b) : null;
    if (a && b && alike && !alike.alike && Math.abs(a.value) > tol && Math.abs(b.value) > tol) {
      add(
        'enantiomer-rotations-not-compared',
        other,
        { value: fmt(a.value), otherValue: fmt(b.value), reason: alike.reason },
        'note',
      );
    } else if (a && b && Math.abs(a.value) > tol && Math.abs(b.value) > tol) {
      const data = { value: fmt(a.value), otherValue: fmt(b.value), conditions: conditions(a) };
      if (Math.sign(a.value) === Math.sign(b.value)) add('enantiomer-rotation-same-sign', other, data);
      else if (
        form === 'single-enantiomer' &&
        otherForm === 'single-enantiomer' &&
        Math.abs(Math.abs(a.value) - Math.abs(b.value)) >
          Math.max(tol, 0.1 * Math.max(Math.abs(a.value), Math.abs(b.value)))
      ) {
        add('enantiomer-rotation-magnitude', other, data, 'note');
      }
    }
  }
  const identical = pairs.filter((p) => p.relation === 'identical').length;
  // rotations that could not be compared are a note, never part of what passed
  const rotations = out.some((f) => f.messageId === 'enantiomer-rotations-not-compared')
    ? '; forms agree, rotations not compared (see the note)'
    : '; forms and rotations agree';
  const passed =
    compared === 0
      ? 'no other registered record is this stereoisomer or its enantiomer'
      : `${identical > 0 ? `the same stereoisomer as ${plural(identical, 'other record')}` : ''}` +
        `${identical > 0 && compared > identical ? ', ' : ''}` +
        `${compared > identical ? `the enantiomer of ${plural(compared - identical, 'registered record')}` : ''}` +
        rotations;
  return { findings: out, passed, pairs };
}

/**
 * Per record the check does nothing: it runs in the registry-wide phase (src/audit/registry-phase.ts), after the
 * record's keys are in the index, through `compareWithRegistry`.
 */
function run(): CheckOutcome {
  return { findings: [], notApplicable: 'runs in the registry-wide phase' };
}

export const consistentWithRegistry: CheckModule = {
  id: 'consistent-with-registry',
  defaultSeverity: 'error',
  summary:
    'A new record is not a duplicate of a registered compound, and agrees with its registered enantiomer.',
  explanation:
    "Every record contributes keys to a registry index: its constitution, and each stereo unit's canonical class " +
    'with its CIP descriptor (IUPAC 2013, P-92.1), as drawn and as its mirror image (src/registry/keys.ts). Two ' +
    "records with equal keys are the same stereoisomer; one whose key equals the other's mirror key is its " +
    'enantiomer (where the keys cannot tell, the engine relates the two structures). An identical structure is ' +
    'the same compound: register a batch, not a new number; under a different form one record is wrong. ' +
    'Enantiomers have identical physical properties except the sense of optical rotation: measured under the ' +
    'same conditions (wavelength, solvent, temperature) their specific rotations are equal in size and opposite ' +
    'in sign (IUPAC Gold Book, enantiomer, optical activity). A racemic drawing (AND group) is compared only with ' +
    'racemic drawings, a relative one (OR group) only with relative ones; a drawing with undefined stereo units ' +
    'is compared with none. Each finding is said once (common practice, no source): in a pull request on the ' +
    'record under review (on the one registered later when both are); in a full audit on the later record in ' +
    "the audit's order (file path order, numbers as numbers; input order for exports), and enantiomer pairs and " +
    'duplicates are listed once in the summary. Registering both enantiomers is normal and is not a finding ' +
    'of a full audit.',
  messages,
  requires: ['structure', 'registry'],
  scope: 'registry',
  run,
};
