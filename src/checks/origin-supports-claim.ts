/**
 * Check: the stereo claim against how the compound was made (the record's origin block). The inputs are placed
 * on the structure (src/chem/provenance); each stereo unit is carried, formed or unmapped; the claim is then held
 * against what the origin allows: racemic products from achiral or racemic inputs without chiral control,
 * carried units that keep their configuration, non-racemic products from enantiopure inputs, diastereomers in
 * unequal amounts. The checklist line gives the expected outcome with its reason beside the declared claim.
 */
import { traceProvenance, type Provenance } from '../chem/provenance/index.js';
import type { StructureFacts } from '../chem/facts.js';
import { closestWord } from '../registry/closest.js';
import { carriedConfigurations, diastereomers, makeAdd, names } from './origin-carried.js';
import { enantiomericPart } from './origin-enantiomers.js';
import { entryById, originCycle, resolveInput, type OriginInput } from './origin-inputs.js';
import { originMessages } from './origin-messages.js';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';

export const ORIGIN_CHECK_ID = 'origin-supports-claim';

/** Inputs whose lookup failed: one finding each. */
function inputProblems(
  ctx: CheckContext,
  from: readonly string[],
  add: ReturnType<typeof makeAdd>,
): OriginInput[] {
  const inputs: OriginInput[] = [];
  from.forEach((text, index) => {
    const r = resolveInput(text, index, ctx.registry);
    const field = `origin.from.${index}`;
    if (r.ok) inputs.push(r.input);
    else if (r.problem === 'no-structure')
      add('input-without-structure', field, { entry: text, detail: r.detail }, 'note');
    else if (r.problem === 'not-found') {
      const ids = ctx.registry.ids?.() ?? ctx.registry.entries.flatMap((e) => (e.id === null ? [] : [e.id]));
      const guess = ids.length <= 50_000 ? closestWord(text.trim(), ids) : null;
      add('input-not-found', field, {
        entry: text,
        suggestion: guess ? ` (did you mean ${guess}?)` : '',
        detail: r.detail,
      });
    } else add('input-unreadable', field, { entry: text, position: index + 1, detail: r.detail });
  });
  return inputs;
}

function unmappedNote(facts: StructureFacts, prov: Provenance, add: ReturnType<typeof makeAdd>): void {
  const unmapped = prov.units.filter((u) => u.fate === 'unmapped');
  if (unmapped.length === 0) return;
  const bound = unmapped.some((u) => u.reason === 'bound');
  add(
    'units-unmapped',
    'origin.from',
    {
      units: names(facts, unmapped),
      pronoun: unmapped.length > 1 ? 'them' : 'it',
      reason: bound
        ? 'the mapping of the inputs onto the structure stopped at its bound (inputs too large or too symmetric to map in time), so no unit is traced'
        : 'no input in origin.from contains these atoms — is an input missing?',
    },
    'note',
  );
}

function run(ctx: CheckContext): CheckOutcome {
  const record = ctx.record;
  const origin = record?.origin;
  if (!record || !origin) return { findings: [], notApplicable: 'no origin given (origin)' };
  const out: RawFinding[] = [];
  const add = makeAdd(out);
  const inputs = inputProblems(ctx, origin.from, add);
  if (record.id && entryById(ctx.registry, record.id)) {
    const cycle = originCycle(record.id, ctx.registry);
    if (cycle) add('origin-cycle', 'origin.from', { cycle: cycle.join(' ← ') });
  }
  const main = ctx.main;
  if (out.length > 0 || !main.structure || !main.facts)
    return out.length > 0
      ? { findings: out }
      : {
          findings: [],
          notRun: main.error
            ? 'the structure could not be read (see structure-readable)'
            : 'the record gives no structure',
        };

  const prov = traceProvenance(
    main.structure,
    inputs.map((i) => i.structure),
  );
  unmappedNote(main.facts, prov, add);
  const expected = enantiomericPart(record, main.facts, prov, inputs, ctx.config, add);
  const { compared } = carriedConfigurations(main.facts, prov, inputs, add, null);
  const mixture = record.stereo.form === 'diastereomer-mixture';
  const comps = mixture
    ? ctx.components.map((c) =>
        c.structure
          ? traceProvenance(
              c.structure,
              inputs.map((i) => i.structure),
            )
          : null,
      )
    : [];
  const dia = diastereomers(
    record,
    main.facts,
    prov,
    inputs,
    comps,
    ctx.components.map((c) => c.facts),
    add,
  );
  if (out.length > 0) return { findings: out };
  const declared = [record.stereo.form, record.stereo.descriptors].filter(Boolean).join(' ');
  const outcome = [expected.outcome, dia, ...compared].filter(Boolean).join('; ');
  return { findings: [], passed: `expected ${outcome} — ${expected.reason}; declared ${declared}` };
}

export const originSupportsClaim: CheckModule = {
  id: ORIGIN_CHECK_ID,
  defaultSeverity: 'error',
  summary:
    'The stereo claim agrees with how the compound was made (origin): racemic from achiral or racemic inputs without chiral control, carried stereo units unchanged, diastereomers in unequal amounts.',
  explanation:
    'A reaction that can form either enantiomer of a product through mirror-image pathways, with nothing chiral ' +
    'present, runs both at the same rate: the two transition states are enantiomeric and equal in energy, so ' +
    'the product is a racemate; enantiotopic groups of a meso or other achiral input likewise react at equal ' +
    'rates. A new stereo unit formed in a molecule that already has a defined one gives diastereomers, whose ' +
    'transition states differ in energy, so they form in unequal amounts (e.g. Cram 1952 on additions to ' +
    'α-chiral aldehydes, from memory). A stereo unit at which no bond is made or broken keeps its spatial ' +
    'arrangement; it is compared through the mapped neighbours, not the CIP label, which can change when ' +
    'priorities change (IUPAC 2013 P-92.1). Inputs are placed on the structure by their largest common ' +
    'connected substructure (elements and bond orders kept), within a time bound; a unit that cannot be traced ' +
    'is left unchecked with a note.',
  messages: originMessages,
  run,
};
