/**
 * The prefix part of descriptors-match-structure: rac / RS,SR / (±) need a racemate; rel / * describe relative
 * configuration; (+)/(−) and D-/L- need an optically active form; meso needs a meso form (IUPAC 2013, P-93.1.3).
 */
import type { ParsedDescriptors } from '../chem/descriptors.js';
import type { StructureFacts } from '../chem/facts.js';
import type { CheckContext, RawFinding } from './types.js';
import { finding, type DeclaredDescriptors } from './words.js';

export const prefixMessages = {
  'racemic-notation-needs-racemate':
    '{field} uses racemic notation ({notation}), which says the substance is a racemate (equal amounts of both ' +
    'enantiomers), but the form is {form}. Declare racemate, or write the descriptors of the one stereoisomer ' +
    'present, e.g. (2R,3S) or, for unknown absolute configuration, rel-(2R,3S).',
  'absolute-descriptors-with-racemate':
    '{field} states {text}, the configuration of one enantiomer, but the form is racemate. For a racemate write ' +
    'rac-(…) or (…RS,…SR) (IUPAC 2013, P-93.1.3), or correct the form.',
  'relative-notation-with-racemate':
    '{field} uses relative notation ({notation}), which describes one enantiomer whose absolute configuration is ' +
    'unknown, but the form is racemate. For a racemate write rac-(…) or (…RS,…SR) (IUPAC 2013, P-93.1.3).',
  'relative-notation-with-absolute-drawing':
    '{field} uses relative notation ({notation}) — absolute configuration unknown — but the structure is drawn ' +
    'with absolute stereo. If the absolute configuration is known, drop rel/*; if not, mark the drawing as ' +
    'relative (an OR group, or a molfile without the chiral flag).',
  'optical-sign-with-inactive-form':
    '{field} gives the sign of rotation ({sign}), but the form is {form}, which is optically inactive (a racemate ' +
    'rotates not at all because its enantiomers cancel; an achiral or meso compound has no optical activity). Use ' +
    '(±) for a racemate, or drop the sign, or correct the form.',
  'legacy-racemate-or-two-centres':
    '{field} writes {text}: (R,S) without locants is the legacy way of naming a racemate, (RS), which does not fit ' +
    'the form {form}; but the structure has {centres} stereocentres, so it may mean two centres cited without ' +
    'locants. Write locants, e.g. (1R,2S), or rac-/(RS) for a racemate.',
  'fischer-prefix-with-form':
    '{field} names one enantiomer ({fischer}-, Fischer–Rosanoff), but the form is {form}. {why} Write DL- or ' +
    '(±)- for a racemate, drop {fischer}- for an achiral compound, or correct the form.',
  'meso-prefix-with-chiral-form':
    '{field} calls the compound meso, but the form is {form}. A meso compound is achiral and has no enantiomer. ' +
    'Correct the name or the form.',
} as const;

type Id = keyof typeof prefixMessages;

function notation(p: ParsedDescriptors): string {
  const parts: string[] = [];
  for (const x of p.prefixes) parts.push(`${x}-`);
  if (p.items.some((i) => i.pair)) parts.push('RS/SR');
  if (p.items.some((i) => i.relativeStar)) parts.push('R*/S*');
  if (p.rotationSign === '±') parts.push('(±)');
  if (p.fischer === 'DL') parts.push('DL');
  return parts.join(', ');
}

export function prefixFindings(
  ctx: CheckContext,
  decl: DeclaredDescriptors,
  facts: StructureFacts,
): RawFinding[] {
  const record = ctx.record;
  if (!record) return [];
  const form = record.stereo.form;
  const out: RawFinding[] = [];
  const sources: { field: string; text: string; p: ParsedDescriptors }[] = [];
  if (decl.field)
    sources.push({ field: 'stereo.descriptors', text: record.stereo.descriptors ?? '', p: decl.field });
  if (decl.name) sources.push({ field: 'name', text: record.name ?? '', p: decl.name });
  const seen = new Set<Id>();
  const add = (id: Id, field: string, data: RawFinding['data'], severity?: RawFinding['severity']): void => {
    if (seen.has(id)) return; // the same contradiction in the name and the descriptors is reported once
    seen.add(id);
    out.push(finding(id, field, { field, form, ...data }, severity));
  };
  const drawnAbsolute =
    facts.enhanced.meaning === 'absolute' &&
    ctx.main.structure?.chiralFlag !== false &&
    facts.chiral === true;
  for (const { field, text, p } of sources) {
    if (p.problemDetails.length > 0 && p.items.length === 0 && p.mode === 'none') continue;
    const onlyLegacy =
      p.legacyPair === true &&
      p.prefixes.length === 0 &&
      p.rotationSign !== '±' &&
      p.fischer !== 'DL' &&
      p.items.length === 1;
    const centres = facts.units.filter((u) => u.kind === 'tetrahedral' && !u.pseudoasymmetric).length;
    if (p.mode === 'racemic' && onlyLegacy && centres >= 2 && form !== 'racemate') {
      // '(R,S)' on a structure with two or more centres: racemate or two centres without locants, unknown which
      add('legacy-racemate-or-two-centres', field, { text, centres }, 'warning');
    } else if (p.mode === 'racemic') {
      if (['single-enantiomer', 'enantioenriched', 'achiral', 'meso'].includes(form)) {
        add('racemic-notation-needs-racemate', field, { notation: notation(p), text });
      } else if (form === 'single-diastereomer') {
        add('racemic-notation-needs-racemate', field, { notation: notation(p), text }, 'warning');
      }
    }
    if (p.mode === 'absolute' && form === 'racemate' && p.items.some((i) => 'RSMP'.includes(i.label))) {
      add('absolute-descriptors-with-racemate', field, { text });
    }
    if (p.mode === 'relative') {
      if (form === 'racemate')
        add('relative-notation-with-racemate', field, { notation: notation(p), text }, 'warning');
      else if ((form === 'single-enantiomer' || form === 'enantioenriched') && drawnAbsolute) {
        add('relative-notation-with-absolute-drawing', field, { notation: notation(p), text }, 'note');
      }
    }
    if (
      (p.rotationSign === '+' || p.rotationSign === '-') &&
      ['racemate', 'meso', 'achiral'].includes(form)
    ) {
      add('optical-sign-with-inactive-form', field, { sign: p.rotationSign === '+' ? '(+)' : '(−)', text });
    }
    if ((p.fischer === 'D' || p.fischer === 'L') && ['racemate', 'meso', 'achiral'].includes(form)) {
      add('fischer-prefix-with-form', field, {
        fischer: p.fischer,
        text,
        why:
          form === 'racemate'
            ? 'A racemate holds both enantiomers, D and L, in equal amounts.'
            : 'An achiral or meso compound has no enantiomer to call D or L.',
      });
    }
    if (p.words.includes('meso') && ['single-enantiomer', 'enantioenriched', 'racemate'].includes(form)) {
      add('meso-prefix-with-chiral-form', field, { text });
    }
  }
  return out;
}
