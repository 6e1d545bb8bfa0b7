/**
 * Check: enhanced stereo (molfile V3000 collections / CXSMILES groups: ABS, AND, OR) against the declared form
 * and the declared descriptors.
 */
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';
import { declaredDescriptors, definedUnits, finding } from './words.js';

const messages = {
  'and-group-with-single-enantiomer':
    'Declared single-enantiomer, but the structure puts {atoms} in an AND group (&{group}), which means "this ' +
    'stereoisomer and its mirror image, together" — a racemic or enantiomer-mixture drawing. Remove the AND group ' +
    '(absolute stereo) or declare racemate / enantioenriched.',
  'or-group-with-racemate':
    'Declared racemate, but the structure puts {atoms} in an OR group (or{group}), which means "this stereoisomer ' +
    'or its mirror image, unknown which" — one enantiomer, not a mixture. Use an AND group for a racemate, or ' +
    'declare single-enantiomer with relative descriptors (rel- or R*).',
  'racemate-drawn-absolute':
    'Declared racemate, but the structure is drawn as one enantiomer with absolute stereo ({labels}; no AND ' +
    'group{flag}). A racemate is drawn with its centres in an AND group (&1), or without stereo marks when it has ' +
    'one stereocentre. Add the AND group, or correct the form.',
  'several-and-groups-with-racemate':
    'Declared racemate, but the structure has {count} AND groups, which stand for more than two stereoisomers (a ' +
    'mixture of diastereomers, each racemic). A racemate needs all its centres in one AND group. Merge the groups ' +
    'or declare diastereomer-mixture.',
  'or-group-with-absolute-descriptors':
    'The descriptors {descriptors} state an absolute configuration, but the structure puts {atoms} in an OR ' +
    'group (or{group}): the absolute configuration is unknown. Write relative descriptors, rel-(…) or (…R*,…S*), ' +
    'or, if the absolute configuration is known, replace the OR group with ABS.',
  'and-group-with-absolute-descriptors':
    'The descriptors {descriptors} state one absolute configuration, but the structure puts {atoms} in an AND ' +
    'group (&{group}): a mixture of the drawn stereoisomer and its mirror image. Write rac-(…) or (…RS,…SR), or ' +
    'remove the AND group.',
  'relative-flag-with-single-enantiomer':
    'Declared single-enantiomer with absolute descriptors {descriptors}, but the molfile has no chiral flag, so ' +
    'the drawing means relative configuration only. Set the chiral flag (the drawing is the absolute ' +
    'configuration) or write relative descriptors.',
} as const;

type Id = keyof typeof messages;

function atomList(atoms: readonly number[]): string {
  return atoms.length === 1 ? `atom ${atoms[0]}` : `atoms ${atoms.join(', ')}`;
}

function run(ctx: CheckContext): CheckOutcome {
  const f = ctx.main.facts;
  const record = ctx.record;
  if (!record || !f) return { findings: [], notApplicable: 'the record or its structure was not read' };
  const form = record.stereo.form;
  const groups = f.enhanced.groups;
  const defined = definedUnits(f);
  if (groups.length === 0 && defined.length === 0)
    return {
      findings: [],
      notApplicable: 'the structure has no enhanced-stereo group and no defined stereo unit',
    };
  const and = groups.filter((g) => g.type === 'and');
  const or = groups.filter((g) => g.type === 'or');
  const decl = declaredDescriptors(record);
  const parsed = decl.field ?? decl.name;
  const descField = decl.field ? 'stereo.descriptors' : 'name';
  const descText = decl.field ? (record.stereo.descriptors ?? '') : (record.name ?? '');
  const out: RawFinding[] = [];
  const add = (id: Id, field: string, data: RawFinding['data'], severity?: RawFinding['severity']): void => {
    out.push(finding(id, field, { form, meaning: f.enhanced.meaning, ...data }, severity));
  };
  if (form === 'single-enantiomer' && and.length > 0) {
    add('and-group-with-single-enantiomer', 'stereo.form', {
      atoms: atomList(and[0].atoms),
      group: and[0].id,
    });
  }
  if (form === 'racemate') {
    if (or.length > 0)
      add('or-group-with-racemate', 'stereo.form', { atoms: atomList(or[0].atoms), group: or[0].id });
    else if (and.length > 1)
      add('several-and-groups-with-racemate', 'stereo.form', { count: and.length }, 'warning');
    else if (and.length === 0 && f.enhanced.meaning === 'absolute' && f.chiral === true) {
      const flag = ctx.main.structure?.chiralFlag === true ? '; the molfile chiral flag is set' : '';
      const labels = defined.map((u) => u.label ?? '?').join(',');
      // With rac-/RS descriptors the record says what the drawing means (rac-(S): the drawn configuration and its
      // mirror image); without them — also a bare rac- or (±) that cites no configuration — it reads as one enantiomer.
      const racemicNamed = parsed?.mode === 'racemic' && parsed.items.length > 0;
      add(
        'racemate-drawn-absolute',
        'stereo.form',
        { labels, flag, racemicDescriptors: racemicNamed },
        racemicNamed ? 'note' : 'warning',
      );
    }
  }
  if (parsed && parsed.mode === 'absolute' && parsed.items.some((it) => 'RSMP'.includes(it.label))) {
    if (or.length > 0) {
      add(
        'or-group-with-absolute-descriptors',
        descField,
        {
          descriptors: descText,
          atoms: atomList(or[0].atoms),
          group: or[0].id,
        },
        'warning',
      );
    } else if (and.length > 0 && form !== 'single-enantiomer') {
      add(
        'and-group-with-absolute-descriptors',
        descField,
        {
          descriptors: descText,
          atoms: atomList(and[0].atoms),
          group: and[0].id,
        },
        'warning',
      );
    } else if (
      form === 'single-enantiomer' &&
      groups.length === 0 &&
      ctx.main.structure?.chiralFlag === false &&
      f.chiral === true
    ) {
      add('relative-flag-with-single-enantiomer', 'structure.molfile', { descriptors: descText }, 'note');
    }
  }
  if (out.some((x) => x.severity !== 'note')) return { findings: out };
  const groupText = groups.length
    ? groups
        .map((g) => `${g.type.toUpperCase()}${g.type === 'abs' ? '' : g.id} (${atomList(g.atoms)})`)
        .join(', ')
    : 'no enhanced-stereo groups';
  return {
    findings: out,
    passed: `drawing means ${f.enhanced.meaning} (${groupText}); consistent with ${form}`,
  };
}

export const enhancedStereoMatchesForm: CheckModule = {
  id: 'enhanced-stereo-matches-form',
  defaultSeverity: 'error',
  summary: 'Enhanced-stereo groups (ABS, AND, OR) agree with the declared form and descriptors.',
  explanation:
    'Enhanced stereo, as defined in the CTfile format specification (V3000 collection blocks MDLV30/STEABS, ' +
    'STERAC, STEREL) and CXSMILES, says what a drawn configuration stands for: ABS — this stereoisomer; AND ' +
    '(racemic group) — this stereoisomer and its mirror image, a mixture; OR (relative group) — this stereoisomer ' +
    'or its mirror image, unknown which. A single enantiomer cannot carry an AND group, a racemate cannot carry ' +
    'an OR group and should not be drawn as absolute, and absolute descriptors (R, S without rel or *) contradict ' +
    'an OR group (IUPAC 2013, P-93.1.3: relative configuration is written rel- or R*).',
  messages,
  requires: ['structure'],
  run,
};
