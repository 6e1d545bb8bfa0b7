/**
 * origin-supports-claim, the configuration part: carried stereo units keep the spatial arrangement of their
 * input (checks 2 and 5 of the origin rules: one enantiomer exactly, a racemic input up to the mirror image), and
 * a carried unit next to a formed one gives diastereomers (check 4): every component of a mixture keeps the
 * carried units, 1:1 is queried, a single diastereomer is fine with its ratio or evidence worth stating.
 */
import type { StructureFacts } from '../chem/facts.js';
import type { Provenance, UnitOrigin } from '../chem/provenance/index.js';
import type { CompoundRecord } from '../registry/types.js';
import { inputName, type OriginInput } from './origin-inputs.js';
import type { OriginMessageId } from './origin-messages.js';
import { parseRatio } from './ratio.js';
import type { RawFinding } from './types.js';
import { finding, unitName } from './words.js';

/** How the origin checks add a finding (shared by origin-carried and origin-enantiomers). */
export type Add = (
  id: OriginMessageId,
  field: string | null,
  data: RawFinding['data'],
  severity?: RawFinding['severity'],
) => void;

/** "C2 (atom 3)" for a product unit, from the product's facts. */
export function productUnitName(facts: StructureFacts, u: Pick<UnitOrigin, 'atoms' | 'kind'>): string {
  const key = u.atoms.join(',');
  const f = facts.units.find((x) => x.atoms.join(',') === key);
  if (f) return unitName(f);
  return u.atoms.length === 1 ? `atom ${u.atoms[0]}` : `the unit at atoms ${u.atoms.join(', ')}`;
}

export function names(facts: StructureFacts, units: readonly UnitOrigin[]): string {
  const n = units.map((u) => productUnitName(facts, u));
  return n.length <= 1 ? (n[0] ?? '') : `${n.slice(0, -1).join(', ')} and ${n[n.length - 1]}`;
}

export function makeAdd(out: RawFinding[]): Add {
  return (id, field, data, severity) => {
    out.push(finding(id, field, data, severity));
  };
}

/** Checks 2 and 5 on one structure (the record's, or a component's): findings, and whether anything was compared. */
export function carriedConfigurations(
  facts: StructureFacts,
  prov: Provenance,
  inputs: readonly OriginInput[],
  add: Add,
  component: number | null,
): { compared: string[] } {
  const compared: string[] = [];
  prov.inputs.forEach((trace) => {
    const input = inputs[trace.input];
    const mine = prov.units.filter((u) => u.fate === 'carried' && u.input === trace.input);
    const inverted = mine.filter((u) => u.configuration === 'inverted');
    const kept = mine.filter((u) => u.configuration === 'same');
    if (trace.relative === 'none') return;
    const who = inputName(input);
    const field = component === null ? 'structure' : `stereo.components.${component}`;
    const racemic = input.status === 'racemic';
    const plural = inverted.length > 1;
    if (component !== null && (trace.relative === 'mixed' || (!racemic && trace.relative === 'mirror'))) {
      add('mixture-component-differs', field, {
        component: component + 1,
        unit: names(facts, inverted),
        input: who,
        formed:
          names(
            facts,
            prov.units.filter((u) => u.fate === 'formed'),
          ) || 'none',
      });
      return;
    }
    if (trace.relative === 'same' || (racemic && trace.relative === 'mirror')) {
      // an enriched input's carried units are named in the expected outcome already
      if (input.status !== 'enriched')
        compared.push(
          `${names(
            facts,
            mine.filter((u) => u.configuration !== 'open'),
          )} as in ${who}${racemic ? ' (relative configuration)' : ''}`,
        );
      return;
    }
    if (racemic) {
      add('carried-relative-differs', field, {
        input: who,
        inverted: names(facts, inverted),
        kept: names(facts, kept),
        verb: plural ? 'are' : 'is',
      });
    } else if (trace.relative === 'mirror') {
      add('carried-enantiomer', field, {
        units: names(facts, inverted),
        verb: plural ? 'are' : 'is',
        pronoun: plural ? 'them' : 'it',
        input: who,
      });
    } else {
      add('carried-epimer', field, {
        inverted: names(facts, inverted),
        kept: names(facts, kept),
        keepS: kept.length > 1 ? '' : 's',
        verb: plural ? 'are' : 'is',
        pronoun: plural ? 'them' : 'it',
        input: who,
      });
    }
  });
  // a carried unit defined on one side only cannot be compared
  const open = prov.units.filter(
    (u) => u.fate === 'carried' && u.configuration === 'open' && u.inputDefined !== u.productDefined,
  );
  if (component === null && open.length > 0) {
    const u = open[0];
    add(
      'carried-unit-open',
      'structure',
      {
        unit: names(facts, open),
        input: inputName(inputs[u.input!]),
        side: u.inputDefined ? 'the structure' : inputName(inputs[u.input!]),
      },
      'note',
    );
  }
  return { compared };
}

/** Check 4: carried plus formed units make diastereomers. Returns the expected-outcome words, or null. */
export function diastereomers(
  record: CompoundRecord,
  facts: StructureFacts,
  prov: Provenance,
  inputs: readonly OriginInput[],
  components: readonly (Provenance | null)[],
  componentFacts: readonly (StructureFacts | null)[],
  add: Add,
): string | null {
  const carried = prov.units.filter((u) => u.fate === 'carried' && u.inputDefined);
  const formed = prov.units.filter((u) => u.fate === 'formed');
  if (carried.length === 0 || formed.length === 0) return null;
  const from = inputName(inputs[carried[0].input!]);
  const data = { carried: names(facts, carried), formed: names(facts, formed), input: from };
  const form = record.stereo.form;
  components.forEach((c, k) => {
    const f = componentFacts[k];
    if (c && f) carriedConfigurations(f, c, inputs, add, k);
  });
  if (form === 'diastereomer-mixture' && record.stereo.ratio !== undefined) {
    const r = parseRatio(record.stereo.ratio);
    if (r.problems.length === 0 && r.parts.length >= 2 && r.parts.every((p) => p === r.parts[0]))
      add('diastereomers-one-to-one', 'stereo.ratio', { ...data, ratio: record.stereo.ratio }, 'note');
  }
  const single = form === 'single-diastereomer' || form === 'single-enantiomer' || form === 'enantioenriched';
  if (single && facts.undefined === 0 && record.stereo.ratio === undefined && !record.stereo.evidence?.length)
    add('diastereomer-ratio-not-stated', 'stereo.form', data, 'note');
  return `diastereomers at ${data.formed} in unequal amounts`;
}
