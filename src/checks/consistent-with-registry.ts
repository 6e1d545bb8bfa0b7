/**
 * Check: a record under review against the records already in the registry — the same compound registered
 * again, the enantiomer of a registered compound (with the rotation signs compared), and the same structure
 * registered under a different form.
 */
import type { StructureFacts } from '../chem/facts.js';
import type { Rotation, StereoForm } from '../registry/types.js';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding, RegistryEntry } from './types.js';
import { conditions } from './rotation-consistent.js';
import { rotationsComparable } from './solvents.js';
import { finding, fmt } from './words.js';

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
  'conflict-reported-on-later-record':
    '{otherId} ({otherFile}), registered after this record, conflicts with it ({conflict}); the finding is ' +
    'reported on {otherId}. Nothing to change here unless {otherId} turns out to be right.',
} as const;

type Id = keyof typeof messages;

/** Findings that say one of two records is wrong; the rest (notes) are said on both records. */
const CONFLICTS: readonly Id[] = [
  'already-registered',
  'same-structure-different-form',
  'enantiomer-rotation-same-sign',
  'enantiomer-form-conflict',
];

/** What the conflict pointer says about the other record's finding. */
const CONFLICT_WORDS: Partial<Record<Id, string>> = {
  'already-registered': 'the same structure registered again under the same form',
  'same-structure-different-form': 'the same structure under another form',
  'enantiomer-rotation-same-sign': 'enantiomers with rotations of the same sign',
  'enantiomer-form-conflict': 'enantiomers of different kinds of form',
};

/**
 * Registry order: ids compared with their numbers as numbers (LX-00024 after LX-00008); a record without an
 * id is not registered yet, so it comes after every record with one. Ties fall back to the file path.
 */
export function registeredLater(a: RegistryEntry, b: RegistryEntry): boolean {
  if (a.id !== b.id) {
    if (a.id === null) return true;
    if (b.id === null) return false;
    return a.id.localeCompare(b.id, 'en', { numeric: true }) > 0;
  }
  return a.file.localeCompare(b.file, 'en', { numeric: true }) > 0;
}

/**
 * Which of two conflicting records carries the finding: a record under review against one that is not (a pull
 * request changing one record) carries it itself; when both are under review (a full audit, or a pull request
 * touching both), the one registered later does.
 */
function carriesConflict(me: RegistryEntry | undefined, other: RegistryEntry): boolean {
  if (!me || !other.underReview) return true;
  return registeredLater(me, other);
}

const ENANTIOPURE: readonly StereoForm[] = ['single-enantiomer', 'enantioenriched'];

function selfEntry(ctx: CheckContext): RegistryEntry | undefined {
  return ctx.registry.entries.find((e) => e.file === ctx.loaded.file && e.id === ctx.loaded.id);
}

function isSelf(ctx: CheckContext, e: RegistryEntry): boolean {
  if (e.file !== ctx.loaded.file) return false;
  // Bulk inputs hold many records in one file: there only the same id is the same record.
  return ctx.loaded.origin.kind === 'file' || e.id === ctx.loaded.id;
}

/**
 * What the drawing stands for: one stereoisomer as drawn, the drawn one and its mirror image together (AND
 * groups), or one of the two, unknown which (OR groups / no chiral flag). Drawings of different kinds are
 * different substances even when the drawn configurations coincide, so they are not compared.
 */
function drawingKind(f: StructureFacts): 'as-drawn' | 'racemic' | 'relative' {
  const m = f.enhanced.meaning;
  if (m === 'racemic' || m === 'mixture') return 'racemic';
  if (m === 'relative') return 'relative';
  return 'as-drawn';
}

function run(ctx: CheckContext): CheckOutcome {
  const record = ctx.record;
  const f = ctx.main.facts;
  const structure = ctx.main.structure;
  if (!record || !f || !structure) return { findings: [], notApplicable: true };
  const me = selfEntry(ctx);
  if (me && !me.underReview) return { findings: [], notApplicable: true };
  const form = record.stereo.form;
  const out: RawFinding[] = [];
  const add = (
    id: Id,
    other: RegistryEntry,
    data: RawFinding['data'],
    severity?: RawFinding['severity'],
  ): void => {
    if (CONFLICTS.includes(id) && !carriesConflict(me, other)) {
      pointers.push(other.id ?? other.file);
      data = { conflict: CONFLICT_WORDS[id] ?? id, otherMessageId: id, ...data };
      id = 'conflict-reported-on-later-record';
      severity = 'note';
    }
    out.push(
      finding(
        id,
        id.startsWith('enantiomer-rotation') ? 'stereo.rotation.value' : 'structure',
        {
          form,
          otherId: other.id ?? other.file,
          otherFile: other.file,
          otherName: other.record.name ? `, ${other.record.name}` : '',
          otherForm: other.record.stereo.form,
          ...data,
        },
        severity,
      ),
    );
  };
  let compared = 0;
  const pointers: string[] = [];
  for (const other of ctx.registry.withConstitution(f.constitutionKey)) {
    const otherFacts = other.main.facts;
    if (isSelf(ctx, other) || !other.main.structure || !otherFacts) continue;
    if (drawingKind(otherFacts) !== drawingKind(f)) continue;
    compared++;
    const rel = ctx.engine.relate(structure, other.main.structure);
    if (rel.relation === 'identical') {
      const otherForm = other.record.stereo.form;
      if (otherForm === form) add('already-registered', other, {}, 'warning');
      else if (ENANTIOPURE.includes(form) && ENANTIOPURE.includes(otherForm)) {
        add('same-structure-other-purity', other, {}, 'note');
      } else add('same-structure-different-form', other, {});
    } else if (rel.relation === 'enantiomers' && f.chiral === true) {
      add('enantiomer-registered', other, { explanation: rel.explanation }, 'note');
      const otherForm = other.record.stereo.form;
      if (ENANTIOPURE.includes(form) !== ENANTIOPURE.includes(otherForm)) {
        add('enantiomer-form-conflict', other, {}, 'warning');
      }
      const a = record.stereo.rotation;
      const b = other.record.stereo.rotation;
      const tol = ctx.config.zeroRotationTolerance;
      const alike = a && b ? rotationsComparable(a, b) : null;
      if (a && b && alike && !alike.alike && Math.abs(a.value) > tol && Math.abs(b.value) > tol) {
        // said once, on the record that carries the pair's conflicts
        if (carriesConflict(me, other))
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
  }
  if (out.some((x) => x.severity !== 'note')) return { findings: out };
  return {
    findings: out,
    passed:
      compared === 0
        ? 'no other registered record has this constitution'
        : pointers.length > 0
          ? `compared with ${compared} registered record(s) of the same constitution; the conflict with ` +
            `${[...new Set(pointers)].join(', ')} is reported on the later record`
          : `compared with ${compared} registered record(s) of the same constitution; no duplicate or conflict`,
  };
}

export const consistentWithRegistry: CheckModule = {
  id: 'consistent-with-registry',
  defaultSeverity: 'error',
  summary:
    'A new record is not a duplicate of a registered compound, and agrees with its registered enantiomer.',
  explanation:
    'Records of the same constitution are related by the engine (identical, enantiomers, diastereomers). An ' +
    'identical structure is the same compound: register a batch, not a new number; under a different form one ' +
    'record is wrong. Enantiomers have identical physical properties except the sense of optical rotation: ' +
    'measured under the same conditions (wavelength, solvent, temperature) their specific rotations are equal in ' +
    'size and opposite in sign (IUPAC Gold Book, enantiomer, optical activity). Only records under review are ' +
    'checked, each against the other records in the checkout; a racemic drawing (AND group) is compared only with ' +
    'racemic drawings, a relative one (OR group) only with relative ones. A conflict between two records (a ' +
    'duplicate, the same structure under another form, enantiomers of the same rotation sign or of different ' +
    'kinds of form) is reported once: on the record under review when the other is not under review (a pull ' +
    'request), and, when both are (a full audit), on the one registered later — the higher registry id, a record ' +
    'without an id counting as newest; the earlier record gets a note naming it (common practice, no source).',
  messages,
  requires: ['structure', 'registry'],
  run,
};
