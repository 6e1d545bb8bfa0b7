/**
 * origin-supports-claim, the enantiomeric part: where an excess of one enantiomer could come from. With every
 * input achiral, meso or racemic and nothing chiral present (origin.control none), the product is racemic (check
 * 1; a desymmetrised meso input is the same case). A carried unit of an enantiopure or enriched input makes the
 * product non-racemic, and its ee no higher than the input's unless the record says it was enriched (check 3).
 * Also works out the expected outcome and its reason, for the checklist line.
 */
import type { StructureFacts } from '../chem/facts.js';
import type { Provenance } from '../chem/provenance/index.js';
import type { AuditConfig } from './types.js';
import type { CompoundRecord, OriginControl } from '../registry/types.js';
import { inputName, type OriginInput } from './origin-inputs.js';
import { names, type Add } from './origin-carried.js';
import { fmt } from './words.js';

const CHIRAL_CONTROL: readonly OriginControl[] = [
  'chiral-catalyst',
  'chiral-reagent',
  'chiral-auxiliary',
  'biocatalyst',
];
const ENRICHING: readonly OriginControl[] = ['resolution', 'chiral-separation', 'enrichment'];

export interface Expected {
  /** The outcome the origin predicts, in a few words. */
  outcome: string;
  /** Why, in one clause. */
  reason: string;
}

/** What the record claims about enantiomeric excess, in words, or null when it claims none. */
function enantioClaim(record: CompoundRecord, config: AuditConfig): { text: string; field: string } | null {
  const s = record.stereo;
  if (s.form === 'single-enantiomer' || s.form === 'enantioenriched')
    return { text: s.form, field: 'stereo.form' };
  if (s.ee !== undefined && s.ee > 2 * config.racemateRatioTolerance)
    return { text: `ee ${fmt(s.ee)}%`, field: 'stereo.ee' };
  if (s.rotation !== undefined && Math.abs(s.rotation.value) > config.zeroRotationTolerance)
    return { text: `a specific rotation of ${fmt(s.rotation.value)}°`, field: 'stereo.rotation' };
  return null;
}

function inputList(inputs: readonly OriginInput[]): string {
  return inputs.map((i) => i.why).join('; ');
}

export function enantiomericPart(
  record: CompoundRecord,
  facts: StructureFacts,
  prov: Provenance,
  inputs: readonly OriginInput[],
  config: AuditConfig,
  add: Add,
): Expected {
  const control = record.origin?.control;
  const claim = enantioClaim(record, config);
  const enriched = inputs.filter((i) => i.status === 'enriched');
  const unknown = inputs.filter((i) => i.status === 'unknown');
  if (facts.chiral === false)
    return { outcome: 'achiral', reason: 'the structure as drawn is superimposable on its mirror image' };

  if (enriched.length === 0) {
    if (control !== undefined && CHIRAL_CONTROL.includes(control))
      return { outcome: 'enantioenriched', reason: `the ${control} is the source of enantiomeric bias` };
    if (control !== undefined && ENRICHING.includes(control))
      return {
        outcome: 'enantioenriched or one enantiomer',
        reason: `the enantiomers were parted by ${control}`,
      };
    if (unknown.length > 0) {
      if (claim)
        add('input-stereo-unknown', claim.field, { claim: claim.text, why: inputList(unknown) }, 'note');
      return { outcome: 'not worked out', reason: inputList(unknown) };
    }
    const formed = prov.units.some((u) => u.fate === 'formed');
    const mixture =
      formed && prov.units.length > 1 ? ' (a racemic pair of each diastereomer that forms)' : '';
    if (control === 'none') {
      if (claim) {
        const desym = inputs.some((i) => i.facts.meso === true || i.form === 'meso');
        add(desym ? 'desymmetrised-without-control' : 'no-source-of-bias', claim.field, {
          claim: claim.text,
          inputs: inputList(inputs),
          expected: `racemate${mixture}`,
        });
      }
      return {
        outcome: `racemate${mixture}`,
        reason:
          'no source of enantiomeric bias (inputs achiral or racemic, control none): enantiomeric transition states are equal in energy',
      };
    }
    if (control === undefined || control === 'unknown') {
      if (claim)
        add(
          'control-not-stated',
          'origin',
          { claim: claim.text, inputs: inputList(inputs), control: control ?? 'not given' },
          'note',
        );
      return {
        outcome: 'racemate unless something chiral was present',
        reason: 'inputs achiral or racemic; origin.control not stated',
      };
    }
    return { outcome: 'not worked out', reason: `origin.control is ${control}` };
  }

  // an enriched input: does one of its stereo units reach the product unchanged?
  const carried = prov.units.filter(
    (u) =>
      u.fate === 'carried' && u.inputDefined && u.productDefined && inputs[u.input!].status === 'enriched',
  );
  if (carried.length === 0)
    return {
      outcome: 'enantiomeric composition set by the reaction',
      reason: `${enriched.map(inputName).join(', ')} ${enriched.length > 1 ? 'are' : 'is'} chiral, but none of its stereo units reaches the product unchanged`,
    };
  const source = inputs[carried[0].input!];
  const who = inputName(source);
  const unitWords = names(
    facts,
    carried.filter((u) => u.input === source.index),
  );
  const inputEe = source.ee ?? (source.id === null ? 100 : null);
  const expected = `non-racemic, ${unitWords} as in ${who}${inputEe !== null ? `, ee at most ${fmt(inputEe)}%` : ''}`;
  const s = record.stereo;
  const racemicClaim =
    s.form === 'racemate' || (s.ee !== undefined && s.ee <= 2 * config.racemateRatioTolerance);
  if (racemicClaim) {
    add('racemate-from-enriched-input', s.form === 'racemate' ? 'stereo.form' : 'stereo.ee', {
      claim: s.form === 'racemate' ? 'racemate' : `ee ${fmt(s.ee!)}%`,
      unit: unitWords,
      input: who,
      why: source.why,
      expected,
    });
  }
  const oneSource = new Set(carried.map((u) => u.input)).size === 1 && enriched.length === 1;
  if (!racemicClaim && oneSource && !(control !== undefined && ENRICHING.includes(control))) {
    const productEe =
      s.ee !== undefined
        ? { value: s.ee, text: `ee ${fmt(s.ee)}%`, source: 'stereo.ee' }
        : s.form === 'single-enantiomer'
          ? {
              value: config.singleEnantiomerMinEe,
              text: `single-enantiomer`,
              source: `at least the registry's ${fmt(config.singleEnantiomerMinEe)}% threshold`,
            }
          : null;
    if (productEe !== null && inputEe === null && source.form === 'enantioenriched')
      add('ee-input-unknown', 'stereo.ee', { claim: productEe.text, unit: unitWords, input: who }, 'note');
    else if (productEe !== null && inputEe !== null && productEe.value > inputEe + config.eeTolerance)
      add(
        'ee-above-input',
        s.ee !== undefined ? 'stereo.ee' : 'stereo.form',
        {
          productEe: productEe.text,
          source: productEe.source,
          unit: unitWords,
          input: who,
          inputEe: fmt(inputEe),
          control: control ?? 'not given',
        },
        'warning',
      );
  }
  return {
    outcome: expected,
    reason: `the configuration of ${who} reaches the product with no bond at ${unitWords} made or broken`,
  };
}
