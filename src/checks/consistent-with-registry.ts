/**
 * Check: a record under review against the records already in the registry — the same compound registered
 * again, the enantiomer of a registered compound (with the rotation signs compared), and the same structure
 * registered under a different form.
 */
import type { StructureFacts } from '../chem/facts.js';
import type { Rotation, StereoForm } from '../registry/types.js';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding, RegistryEntry } from './types.js';
import { conditions } from './rotation-consistent.js';
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
  'enantiomer-form-conflict':
    'This compound is declared {form}, but its enantiomer {otherId} is registered as {otherForm}. Enantiomers have ' +
    'the same kind of form (both single enantiomers, or both enriched); check both records.',
} as const;

type Id = keyof typeof messages;

const ENANTIOPURE: readonly StereoForm[] = ['single-enantiomer', 'enantioenriched'];

function selfEntry(ctx: CheckContext): RegistryEntry | undefined {
  return ctx.registry.entries.find((e) => e.file === ctx.loaded.file && e.id === ctx.loaded.id);
}

function isSelf(ctx: CheckContext, e: RegistryEntry): boolean {
  if (e.file !== ctx.loaded.file) return false;
  // Bulk inputs hold many records in one file: there only the same id is the same record.
  return ctx.loaded.origin.kind === 'file' || e.id === ctx.loaded.id;
}

/** Same wavelength (missing = 589 nm), same solvent (case-insensitive), temperatures within 5 °C. */
function measuredAlike(a: Rotation, b: Rotation): boolean {
  const nm = (r: Rotation): number => r.wavelength_nm ?? 589;
  if (Math.abs(nm(a) - nm(b)) > 1) return false;
  if ((a.solvent ?? '').trim().toLowerCase() !== (b.solvent ?? '').trim().toLowerCase()) return false;
  if (
    a.temperature_c !== undefined &&
    b.temperature_c !== undefined &&
    Math.abs(a.temperature_c - b.temperature_c) > 5
  ) {
    return false;
  }
  return true;
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
      if (a && b && measuredAlike(a, b) && Math.abs(a.value) > tol && Math.abs(b.value) > tol) {
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
    'racemic drawings, a relative one (OR group) only with relative ones.',
  messages,
  run,
};
