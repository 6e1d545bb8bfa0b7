/**
 * Check: a stereo claim that rests only on an ordinary amine nitrogen, which inverts rapidly and is therefore
 * not a stereocentre at room temperature.
 */
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';
import { declaredDescriptors, definedUnits, finding, plural, STEREO_CLAIM_FORMS } from './words.js';

export const NITROGEN_CHECK_ID = 'nitrogen-inversion';

/**
 * This check reports the record's stereo claim as an error because the structure has no stereo unit at all and
 * the only configuration drawn is on ordinary amine nitrogens (and the registry has not switched the check off
 * or down to a note). The other
 * checks then see the same root cause and report their side of it as notes pointing here.
 */
export function claimRestsOnlyOnNitrogen(ctx: CheckContext): boolean {
  const f = ctx.main.facts;
  const form = ctx.record?.stereo.form;
  return (
    f !== null &&
    form !== undefined &&
    STEREO_CLAIM_FORMS.includes(form) &&
    f.units.length === 0 &&
    f.invertibleNitrogens.length > 0 &&
    !['off', 'note'].includes(ctx.config.severities[NITROGEN_CHECK_ID] ?? 'error')
  );
}

/** The descriptors the record states, in words for the advice ('' when none). */
function statedDescriptors(ctx: CheckContext): string {
  const record = ctx.record;
  const decl = declaredDescriptors(record);
  if (decl.field && decl.field.items.length > 0)
    return ` and drop ${record?.stereo.descriptors ?? ''} from stereo.descriptors`;
  if (decl.name && decl.name.items.length > 0) {
    const name = record?.name ?? '';
    const front = name
      .slice(0, name.length - decl.name.rest.length)
      .replace(/[-\s\u2010-\u2014\u2212\uFE63\uFF0D\u02D7]+$/, '');
    return ` and drop ${front} from the name`;
  }
  return '';
}

const messages = {
  'claim-rests-on-invertible-nitrogen':
    'Declared {form}, but the only stereo drawn or implied is at nitrogen {atoms}, an ordinary amine nitrogen. ' +
    'Such a nitrogen inverts through a planar transition state many times a second at room temperature (barrier ' +
    'roughly 30–40 kJ/mol for simple trialkylamines, about 24 kJ/mol for ammonia — values from memory; a ' +
    'configuration that can be isolated at room temperature needs roughly 100 kJ/mol), so its two ' +
    'configurations interconvert and cannot be isolated: the ' +
    "structure has no stereocentre. Declare achiral{dropDescriptors}, or, if the nitrogen is locked (a bridgehead as in Tröger's " +
    'base, an aziridine, a quaternary ammonium ion), draw that feature.',
  'stereo-drawn-on-invertible-nitrogen':
    'The structure draws a configuration on nitrogen {atoms}, an ordinary amine nitrogen that inverts rapidly at ' +
    'room temperature; that configuration means nothing. The claim rests on the other stereo units, which is fine; ' +
    'remove the wedge or @ mark at that nitrogen.',
} as const;

function run(ctx: CheckContext): CheckOutcome {
  const record = ctx.record;
  const f = ctx.main.facts;
  if (!record || !f) return { findings: [], notApplicable: 'the record or its structure was not read' };
  if (f.invertibleNitrogens.length === 0)
    return { findings: [], notApplicable: 'the structure has no amine nitrogen that inverts' };
  const form = record.stereo.form;
  const drawn = f.invertibleNitrogens.filter((n) => n.drawnWithStereo);
  const out: RawFinding[] = [];
  const claims = STEREO_CLAIM_FORMS.includes(form);
  const others = definedUnits(f).filter(
    (u) => !f.invertibleNitrogens.some((n) => u.atoms.includes(n.atom) && u.kind === 'tetrahedral'),
  );
  const atomsOf = (list: typeof f.invertibleNitrogens): string =>
    list.map((n) => `(atom ${n.atom})`).join(', ');
  if (claims && others.length === 0) {
    const list = drawn.length ? drawn : f.invertibleNitrogens;
    out.push(
      finding('claim-rests-on-invertible-nitrogen', 'stereo.form', {
        form,
        atoms: atomsOf(list),
        drawnWithStereo: drawn.length > 0,
        dropDescriptors: statedDescriptors(ctx),
      }),
    );
  } else if (drawn.length > 0) {
    out.push(
      finding('stereo-drawn-on-invertible-nitrogen', 'structure', { form, atoms: atomsOf(drawn) }, 'note'),
    );
  }
  if (out.some((x) => x.severity !== 'note')) return { findings: out };
  if (out.length === 0 && drawn.length === 0)
    return {
      findings: [],
      notApplicable: 'no stereo drawn at an amine nitrogen and no claim resting on one',
    };
  return {
    findings: out,
    passed: `the claim rests on ${plural(others.length, 'stereo unit')} other than amine nitrogens`,
  };
}

export const nitrogenInversion: CheckModule = {
  id: NITROGEN_CHECK_ID,
  defaultSeverity: 'error',
  summary: 'A stereo claim does not rest only on an ordinary amine nitrogen, which inverts rapidly.',
  explanation:
    'A trivalent amine nitrogen with three different substituents is pyramidal, but it inverts through a planar ' +
    'transition state with a low barrier (from memory: about 24 kJ/mol for ammonia, roughly 30–40 kJ/mol for ' +
    'simple trialkylamines; invertomers that can be isolated at room temperature need a barrier of roughly ' +
    '100 kJ/mol, also from memory), so its enantiomers interconvert rapidly at room temperature and ' +
    'cannot be separated; IUPAC Gold Book, pyramidal inversion. It is a stereocentre only when inversion is ' +
    "blocked: a bridgehead (Tröger's base), a small ring (aziridines, slowly), or four substituents (ammonium " +
    'ions, N-oxides). The engine lists such ordinary nitrogens separately from the stereocentres. When the claim ' +
    'rests on nothing else, this check carries the error; the form, descriptor and reading checks report their ' +
    'side of the same root cause as notes.',
  messages,
  requires: ['structure'],
  run,
};
