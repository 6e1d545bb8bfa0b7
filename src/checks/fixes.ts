/**
 * Certain corrections the checks can offer (shown on the pull request as suggested changes): descriptors relabelled
 * to the computed CIP labels, and the (+)/(−) sign turned to agree with the measured rotation. Each returns null
 * unless the corrected text is unambiguous; then the responsible chemist accepts it, or rejects it when the drawing
 * (or the measurement) is what is wrong. Measured values are never corrected.
 */
import type { DescriptorComparison, ParsedDescriptors } from '../chem/descriptors.js';
import type { StereoUnitFact } from '../chem/facts.js';
import type { Fix } from '../audit/types.js';

const PLAIN_LABEL = /^[RSEZMP]$/;

function plainItems(parsed: ParsedDescriptors): boolean {
  return parsed.items.every((it) => !it.pair && !it.relativeStar && !it.axial && PLAIN_LABEL.test(it.label));
}

/**
 * `text` with the label of each mismatched item replaced by the computed one, when items were matched to units
 * one by one (through atom maps, or one unit of each kind) and not up to inversion.
 */
export function relabelFix(
  field: string,
  text: string,
  parsed: ParsedDescriptors,
  cmp: DescriptorComparison,
): Fix | null {
  if (cmp.method !== 'per-locant' && cmp.method !== 'per-unit') return null;
  if (cmp.matchedInverted || !plainItems(parsed)) return null;
  if (cmp.mismatches.length === 0 || cmp.notStereoUnits.length > 0 || cmp.undefinedAt.length > 0) return null;
  // Offsets count UTF-16 code units, as string indices do; every letter is checked before it is replaced.
  let out = text;
  for (const m of cmp.mismatches) {
    if (!PLAIN_LABEL.test(m.computed)) return null;
    const items = parsed.items.filter((it) => (it.locant ?? '') === m.locant && it.label === m.declared);
    if (items.length !== 1) return null;
    const item = items[0]!;
    const at = item.offset + m.locant.length;
    if (out[at] !== m.declared) return null;
    out = out.slice(0, at) + m.computed + out.slice(at + 1);
  }
  return out === text ? null : { field, from: text, to: out };
}

/** One descriptor without locant against the one stereo unit of the structure: `(R)` becomes `(S)`. */
export function singleLabelFix(
  field: string,
  text: string,
  parsed: ParsedDescriptors,
  units: readonly StereoUnitFact[],
): Fix | null {
  if (parsed.mode !== 'absolute' || parsed.items.length !== 1 || !plainItems(parsed)) return null;
  if (units.length !== 1 || !units[0]!.defined) return null;
  const computed = units[0]!.label;
  const item = parsed.items[0]!;
  if (computed === null || !PLAIN_LABEL.test(computed) || item.locant !== null) return null;
  if (text[item.offset] !== item.label || computed === item.label) return null;
  return { field, from: text, to: text.slice(0, item.offset) + computed + text.slice(item.offset + 1) };
}

/** A (+) or (−) written in `value` (any minus look-alike), turned to the sign the rotation shows. */
export function signFix(field: string, value: string, measuredPositive: boolean): Fix | null {
  const signs = [
    ...value.matchAll(/\((?:\+|\uFF0B|[-\u2010-\u2012\u2013\u2014\u2212\uFE63\uFF0D\u02D7])\)/g),
  ];
  if (signs.length !== 1) return null;
  const from = signs[0]![0];
  const to = measuredPositive ? '(+)' : '(-)';
  return from === to ? null : { field, from, to };
}
