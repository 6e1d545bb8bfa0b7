/**
 * Check: the specific rotation (stereo.rotation) against the declared form and the (+)/(−) sign in the name or
 * descriptors.
 */
import type { Rotation } from '../registry/types.js';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';
import { declaredSign, finding, fmt } from './words.js';
import { signFix } from './fixes.js';

const messages = {
  'rotation-should-be-zero':
    'Declared {form}, but the specific rotation is {value}° ({conditions}); it should be zero within ±{tolerance}°, ' +
    'because {why}. Check the sample (an enantiomeric excess, an optically active impurity) or the form.',
  'sign-disagrees-with-rotation':
    '{field} states {sign}, but the measured specific rotation is {value}° ({conditions}). Correct the sign in the ' +
    'name or descriptors, or re-check the measurement.{wavelengthNote}',
  'sign-with-zero-rotation':
    '{field} states {sign}, but the measured specific rotation is {value}° ({conditions}), zero within ±{tolerance}°. ' +
    'A sign needs a measurable rotation: measure at higher concentration or another wavelength, or drop the sign.',
  'single-enantiomer-zero-rotation':
    'Declared single-enantiomer, but the specific rotation is {value}° ({conditions}), zero within ±{tolerance}°. ' +
    'Some enantiomers rotate very little at the sodium D line, but a zero reading is also what a racemate gives. ' +
    'Was the enantiomeric purity shown another way (chiral HPLC)? Record that evidence.',
} as const;

type Id = keyof typeof messages;

const WHY: Record<string, string> = {
  racemate:
    'a racemate holds equal amounts of two enantiomers, whose rotations are equal and opposite and cancel',
  meso: 'a meso compound is achiral, and achiral substances are optically inactive',
  achiral: 'achiral substances are optically inactive',
};

export function conditions(r: Rotation): string {
  const c: string[] = [];
  c.push(r.wavelength_nm !== undefined ? `${fmt(r.wavelength_nm)} nm` : 'wavelength not given');
  if (r.temperature_c !== undefined) c.push(`${fmt(r.temperature_c)} °C`);
  if (r.solvent !== undefined) c.push(r.solvent);
  if (r.concentration !== undefined) c.push(`c ${fmt(r.concentration)}`);
  return c.join(', ');
}

/** The sodium D line, 589 nm (589.0/589.6 doublet), to which signs in names normally refer. */
function isSodiumD(nm: number | undefined): boolean {
  return nm === undefined || Math.abs(nm - 589) <= 1;
}

function run(ctx: CheckContext): CheckOutcome {
  const record = ctx.record;
  if (!record) return { findings: [], notApplicable: 'the record was not read' };
  const form = record.stereo.form;
  const rot = record.stereo.rotation;
  const sign = declaredSign(record);
  if (!rot) return { findings: [], notApplicable: 'no rotation given (stereo.rotation)' };
  const tol = ctx.config.zeroRotationTolerance;
  const out: RawFinding[] = [];
  const base = { form, value: rot.value, conditions: conditions(rot), tolerance: tol };
  const add = (id: Id, field: string, data: RawFinding['data'], severity?: RawFinding['severity']): void => {
    out.push(finding(id, field, { ...base, ...data }, severity));
  };
  const zero = Math.abs(rot.value) <= tol;
  if (WHY[form] && !zero) add('rotation-should-be-zero', 'stereo.rotation.value', { why: WHY[form] });
  if (sign && sign.sign !== '±') {
    const signText = sign.sign === '+' ? '(+)' : '(−)';
    if (zero) add('sign-with-zero-rotation', sign.field, { field: sign.field, sign: signText }, 'warning');
    else if ((sign.sign === '+') !== rot.value > 0) {
      const d = isSodiumD(rot.wavelength_nm);
      add(
        'sign-disagrees-with-rotation',
        sign.field,
        {
          field: sign.field,
          sign: signText,
          wavelengthNote: d
            ? ''
            : ' The rotation was measured away from the sodium D line (589 nm), where the sign can differ ' +
              '(optical rotatory dispersion); signs in names refer to 589 nm unless stated.',
        },
        d ? undefined : 'note',
      );
      // At 589 nm the measured sign decides the prefix (the measurement itself is never changed).
      const value = sign.field === 'name' ? record.name : record.stereo.descriptors;
      const fix = d && value !== undefined ? signFix(sign.field, value, rot.value > 0) : null;
      if (fix !== null) out[out.length - 1]!.fix = fix;
    }
  }
  if (form === 'single-enantiomer' && zero)
    add('single-enantiomer-zero-rotation', 'stereo.rotation.value', {}, 'note');
  if (out.some((x) => x.severity !== 'note')) return { findings: out };
  const s =
    sign && sign.sign !== '±' ? `; sign ${sign.sign === '+' ? '(+)' : '(−)'} in ${sign.field} agrees` : '';
  return {
    findings: out,
    passed: `specific rotation ${fmt(rot.value)}° (${conditions(rot)}) fits ${form}${s}`,
  };
}

export const rotationConsistent: CheckModule = {
  id: 'rotation-consistent',
  defaultSeverity: 'error',
  summary: 'The specific rotation agrees with the declared form and with the (+)/(−) sign in the name.',
  explanation:
    'Optical activity needs chiral molecules in enantiomeric excess: an achiral or meso compound is optically ' +
    'inactive, and a racemate is optically inactive because its enantiomers rotate equally in opposite senses ' +
    '(IUPAC Gold Book: optical activity, racemate, meso). The prefixes (+) and (−) state the sign of rotation, ' +
    'normally at the sodium D line, 589 nm (IUPAC 2013, P-93). A single enantiomer with zero rotation is possible ' +
    'but rare and is only noted. What counts as zero is a registry setting (zeroRotationTolerance).',
  messages,
  run,
};
