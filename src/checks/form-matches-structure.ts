/**
 * Check: the declared stereo form (stereo.form) against what the structure says — chirality, meso, defined and
 * undefined stereo units, and for mixtures the relation between the components.
 */
import type { Count, StructureFacts } from '../chem/facts.js';
import type { Structure } from '../chem/types.js';
import { countValue, exactCount } from '../chem/index.js';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';
import {
  atomsInRecordTerms,
  definedUnits,
  finding,
  listUnits,
  undefinedUnits,
  unitSummary,
} from './words.js';
import { mixtureFindings, mixtureMessages } from './form-mixtures.js';
import { claimRestsOnlyOnNitrogen, NITROGEN_CHECK_ID } from './nitrogen-inversion.js';

const messages = {
  'achiral-but-chiral':
    'Declared achiral, but the structure is chiral: it has {allUnits} and its mirror image is a different ' +
    'molecule ({mirror}). Declare single-enantiomer, enantioenriched or racemate, or correct the structure.',
  'achiral-but-open':
    'Declared achiral, but {undefinedCount:stereo unit is|stereo units are} left undefined ({undefinedUnits}), so whether the ' +
    'substance is chiral is open. Define those units in the structure, or declare the form unknown.',
  'achiral-is-meso':
    'Declared achiral. The structure is indeed achiral ({mirror}), but its constitution also has chiral ' +
    'stereoisomers ({chiralIsomers} of {totalIsomers}), which makes this one a meso compound. Declare meso.',
  'meso-but-chiral':
    'Declared meso, but the structure is chiral: it defines {units} and its mirror image is a different molecule ' +
    '({mirror}). A meso compound is achiral. Check the configurations ({labels}) or declare single-enantiomer.',
  'meso-but-no-chiral-isomers':
    'Declared meso, but no stereoisomer of this constitution is chiral ({totalIsomers:stereoisomer, ' +
    'achiral|stereoisomers, all achiral}), so the compound is simply achiral: meso applies only to an achiral member of a set that includes ' +
    'chiral members. Declare achiral.',
  'meso-but-open':
    'Declared meso, but {undefinedCount:stereo unit is|stereo units are} undefined ({undefinedUnits}); the drawing also covers ' +
    'chiral stereoisomers. Define every unit as in the meso form.',
  'enantiomer-but-achiral':
    'Declared {form}, but the structure is identical to its mirror image ({mirror}), so it has no enantiomer and ' +
    'no enantiomeric excess. {remedy}',
  'enantiomer-undefined-units':
    'Declared {form}, but {undefinedCount:stereo unit is|stereo units are} undefined: {undefinedUnits}. The structure then ' +
    'stands for {isomers} stereoisomers, not one enantiomer. Define every unit, or declare unknown.',
  'racemate-but-achiral':
    'Declared racemate, but the structure is identical to its mirror image ({mirror}), so it cannot form a ' +
    'racemate. {remedy}',
  'racemate-no-chiral-isomers':
    'Declared racemate, but no stereoisomer of this constitution is chiral ({totalIsomers:stereoisomer, ' +
    'achiral|stereoisomers, all achiral}), so there are no enantiomers to mix. Declare achiral.',
  'racemate-which-diastereomer':
    'Declared racemate, drawn with {undefinedCount:undefined stereo unit|undefined stereo units} ({undefinedUnits}). This ' +
    'constitution has {pairs:pair|pairs} of enantiomers{achiralPart}, so the drawing does not say which ' +
    "diastereomer's racemate it is. Draw the relative configuration and mark it racemic (AND group, or rac-).",
  'diastereomer-too-few-units':
    'Declared single-diastereomer, but the structure defines {definedCount:stereo unit|stereo units} ({units}); ' +
    'diastereomers need at least two stereogenic units, or a stereogenic double bond. Declare single-enantiomer, ' +
    'achiral or unknown, or define the missing units.',
  'diastereomer-undefined-units':
    'Declared single-diastereomer, but {undefinedCount:stereo unit is|stereo units are} undefined ({undefinedUnits}), so the ' +
    'drawing covers several diastereomers. Define them, or declare diastereomer-mixture.',
  'enantiomer-but-drawn-mixture':
    'Declared {form}, but the structure holds {mixtureCount} different stereoisomers of the parent as separate ' +
    'molecules ({mixtureText}). Draw the one stereoisomer alone, or declare the form the drawing shows ' +
    '(racemate, enantioenriched, diastereomer-mixture).',
  'racemate-drawn-not-racemic':
    'Declared racemate, but the molecules drawn are not two enantiomers in equal numbers ({mixtureText}). A ' +
    'racemate is a 1:1 mixture of a pair of enantiomers; correct the drawing or the form.',
  'form-open-unstated-units':
    'Declared {form}: not verified. The structure has {openUnits}, whose configuration the structure as given ' +
    'cannot state (a SMILES has no notation for a stereogenic axis, a helix or a planar twist; 2D coordinates ' +
    'state no planar twist), so whether it stands for one stereoisomer, a racemate or an achiral compound is ' +
    'open. Biaryl axes are found by a rule of thumb on ortho substitution (common practice, no source). Draw the ' +
    'unit to have the claim checked: an axis with wedges in a molfile or a CXSMILES with 2D coordinates, a helix ' +
    'or a planar twist with 3D coordinates.',
  ...mixtureMessages,
} as const;

export type FormMessageId = keyof typeof messages;

/** The larger of an exact count and a bigint, as a bigint. */
function maxCount(c: Count, b: bigint): bigint {
  const v = countValue(c);
  return v > b ? v : b;
}

function evidence(f: StructureFacts, s: Structure | null) {
  const defined = definedUnits(f);
  // units the input format cannot state are open, not missing from the drawing (see form-open-unstated-units)
  const undef = undefinedUnits(f).filter((u) => !u.formatCannotState);
  const open = f.units.filter((u) => u.formatCannotState);
  return {
    units: unitSummary(defined),
    allUnits: unitSummary(f.units) + (undef.length ? `, ${undef.length} undefined` : ''),
    labels: defined.length ? defined.map((u) => `${u.label ?? '?'}`).join(',') : 'none are drawn',
    mirror:
      atomsInRecordTerms(f.mirror.explanation, s) ||
      (f.chiral ? 'not superimposable on its mirror image' : 'superimposable'),
    undefinedCount: undef.length,
    undefinedUnits: listUnits(undef),
    openCount: open.length,
    openUnits: listUnits(open),
    definedCount: defined.length,
    totalIsomers: f.stereoisomers.total,
    chiralIsomers: f.stereoisomers.chiral,
    pairs: f.stereoisomers.pairs,
    isomers: exactCount(maxCount(f.stereoisomers.total, 2n ** BigInt(undef.length))),
    mixtureCount: f.mixture?.stereoisomers ?? 1,
    mixtureText: f.mixture?.explanation ?? '',
  };
}

/**
 * What an achiral structure declared chiral can become: meso only when it is one (achiral with chiral
 * stereoisomers, Gold Book); with no stereo unit at all no configuration can make it chiral.
 */
function achiralRemedy(f: StructureFacts, labels: string, nitrogen: string | null): string {
  if (nitrogen !== null) {
    return (
      `Its only configuration is drawn at ${nitrogen}, an ordinary amine nitrogen that inverts rapidly; ` +
      'nitrogen-inversion reports this claim as the error to fix.'
    );
  }
  if (f.meso === true) return `Declare meso, or correct the configurations (${labels}).`;
  if (f.units.length === 0) {
    return (
      'The structure has no stereo unit, so no configuration can make it chiral: declare achiral, or correct ' +
      'the structure if a chiral compound was meant.'
    );
  }
  return (
    `No stereoisomer of this constitution is chiral, so no configuration can make it so (drawn: ${labels}): ` +
    'declare achiral (single-diastereomer for one cis/trans isomer), or correct the structure.'
  );
}

function run(ctx: CheckContext): CheckOutcome {
  const f = ctx.main.facts;
  const record = ctx.record;
  if (!record || !f) return { findings: [], notApplicable: 'the record or its structure was not read' };
  const form = record.stereo.form;
  const e = evidence(f, ctx.main.structure);
  const out: RawFinding[] = [];
  // The claim rests only on an invertible amine nitrogen: nitrogen-inversion carries the error; the form's side
  // of the same root cause is a note here.
  const nitrogen = claimRestsOnlyOnNitrogen(ctx)
    ? f.invertibleNitrogens.map((n) => `nitrogen (atom ${n.atom})`).join(', ')
    : null;
  const add = (
    id: FormMessageId,
    extra: RawFinding['data'] = {},
    severity?: RawFinding['severity'],
  ): void => {
    const why: RawFinding['data'] = nitrogen !== null ? { explainedBy: NITROGEN_CHECK_ID } : {};
    out.push(
      finding(id, 'stereo.form', { form, ...e, ...extra, ...why }, nitrogen !== null ? 'note' : severity),
    );
  };
  const remedy = achiralRemedy(f, e.labels, nitrogen);
  /** The form word the structure decides, when it decides one (a suggested change on the pull request). */
  const fixTo = (to: string): void => {
    const last = out[out.length - 1];
    if (last !== undefined && nitrogen === null) last.fix = { field: 'stereo.form', from: form, to };
  };
  const achiralTo = f.meso === true ? 'meso' : f.units.length === 0 ? 'achiral' : null;
  const defined = definedUnits(f);
  const bonds = defined.filter((u) => u.kind === 'double-bond').length;
  // Only units the format cannot state are open: the claim is unverified (a note), never an error.
  const openOnly = e.openCount > 0 && e.undefinedCount === 0;
  if (e.openCount > 0 && form !== 'unknown' && form !== 'diastereomer-mixture')
    add('form-open-unstated-units', {}, 'note');
  switch (openOnly && f.chiral !== true ? 'open' : form) {
    case 'achiral':
      if (f.chiral === true) add('achiral-but-chiral');
      else if (f.chiral === null || e.undefinedCount > 0) {
        if (countValue(f.stereoisomers.chiral) > 0n || f.chiral === null)
          add('achiral-but-open', {}, 'warning');
      } else if (f.meso === true) {
        add('achiral-is-meso', {}, 'note');
        fixTo('meso');
      }
      break;
    case 'meso':
      if (f.chiral === true) add('meso-but-chiral');
      else if (e.undefinedCount > 0 || f.meso === null) add('meso-but-open');
      else if (f.meso === false) {
        add('meso-but-no-chiral-isomers', {}, 'warning');
        fixTo('achiral');
      }
      break;
    case 'single-enantiomer':
    case 'enantioenriched':
      // a drawn mixture of the two enantiomers in unequal numbers is what enantioenriched means
      if (f.mixture && !(form === 'enantioenriched' && f.mixture.kind === 'enantiomers'))
        add('enantiomer-but-drawn-mixture');
      else if (f.chiral === false && e.undefinedCount === 0) {
        add('enantiomer-but-achiral', { remedy });
        if (achiralTo !== null) fixTo(achiralTo);
      } else if (e.undefinedCount > 0)
        add('enantiomer-undefined-units', {}, form === 'enantioenriched' ? 'warning' : undefined);
      break;
    case 'racemate':
      if (f.mixture && f.mixture.kind !== 'racemate') add('racemate-drawn-not-racemic');
      else if (f.chiral === false && e.undefinedCount === 0) {
        add('racemate-but-achiral', { remedy });
        if (achiralTo !== null) fixTo(achiralTo);
      } else if (e.undefinedCount > 0 && f.stereoisomers.chiral === 0) {
        add('racemate-no-chiral-isomers');
        fixTo('achiral');
      } else if (
        e.undefinedCount > 0 &&
        (countValue(f.stereoisomers.pairs) > 1n || countValue(f.stereoisomers.achiral) > 0n)
      ) {
        const a = f.stereoisomers.achiral;
        add(
          'racemate-which-diastereomer',
          {
            achiralPart: a ? ` and ${a} achiral ${String(a) === '1' ? 'stereoisomer' : 'stereoisomers'}` : '',
          },
          'warning',
        );
      }
      break;
    case 'single-diastereomer':
      if (defined.length < 2 && bonds === 0) add('diastereomer-too-few-units');
      else if (e.undefinedCount > 0) add('diastereomer-undefined-units', {}, 'warning');
      break;
    case 'diastereomer-mixture':
    case 'unknown':
      break;
  }
  out.push(...mixtureFindings(ctx, f));
  if (out.some((x) => x.severity !== 'note' || x.messageId === 'form-open-unstated-units'))
    return { findings: out };
  return { findings: out, passed: passedEvidence(form, f, e) };
}

function passedEvidence(form: string, f: StructureFacts, e: ReturnType<typeof evidence>): string {
  if (form === 'unknown') {
    return e.undefinedCount
      ? `form unknown; undefined stereo units: ${e.undefinedUnits}`
      : `form unknown; the structure defines ${e.units} and leaves none undefined`;
  }
  const chir =
    f.chiral === true ? 'chiral' : f.chiral === false ? (f.meso ? 'meso (achiral)' : 'achiral') : 'open';
  const why = f.chiral !== null && f.mirror.explanation ? ` — ${e.mirror}` : '';
  return `declared ${form}; structure is ${chir} (${e.allUnits})${why}`;
}

export const formMatchesStructure: CheckModule = {
  id: 'form-matches-structure',
  defaultSeverity: 'error',
  summary:
    'The declared stereo form agrees with the chirality, meso character and defined units of the structure.',
  explanation:
    'IUPAC Gold Book definitions: a chiral molecule is not superimposable on its mirror image; enantiomers are ' +
    'mirror-image stereoisomers; a racemate is an equimolar mixture of a pair of enantiomers, so it needs a ' +
    'chiral structure; a meso compound is the achiral member of a set of diastereoisomers that also includes ' +
    'chiral members; diastereoisomers are stereoisomers that are not enantiomers (cis-trans isomers included). ' +
    'A single enantiomer therefore needs a chiral structure with every stereo unit defined, a single ' +
    'diastereomer two or more stereogenic units (or a stereogenic double bond), and a diastereomer mixture two ' +
    'or more components that are pairwise diastereomers with the constitution of the parent. The evidence is ' +
    "the engine's mirror-image analysis (the symmetry element that makes a structure achiral) and its " +
    'stereoisomer count.',
  messages,
  requires: ['structure'],
  run,
};
