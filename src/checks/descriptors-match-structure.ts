/**
 * Check: the IUPAC stereodescriptors a record states (stereo.descriptors, the front of its name, and each
 * component's descriptors) against the CIP labels computed from the structure, and their prefixes (rac, rel,
 * RS/SR, *, (±), (+)/(−), meso) against the declared form.
 */
import {
  compareDescriptors,
  type DescriptorComparison,
  type ParsedDescriptors,
} from '../chem/descriptors.js';
import type { StructureFacts } from '../chem/facts.js';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';
import { declaredDescriptors, finding, labelList, listUnits } from './words.js';
import { parseDescriptors } from '../chem/descriptors.js';
import { prefixFindings, prefixMessages } from './descriptor-prefixes.js';
import { cisTransFindings, cisTransMessages } from './cis-trans-words.js';
import { distinctUnits, repeatedComponents } from './repeated-components.js';
import { claimRestsOnlyOnNitrogen, NITROGEN_CHECK_ID } from './nitrogen-inversion.js';
import type { ReadStructure } from './types.js';
import type { StructureSource } from '../registry/types.js';
import { unverifiedFinding, unverifiedMessages } from './descriptors-unverified.js';
import { withAtomMaps } from './mapped-smiles.js';
import { relabelFix, singleLabelFix } from './fixes.js';

const messages = {
  'descriptor-unreadable':
    "The descriptors in {field} ('{text}') could not be read: {problem}. Write them as IUPAC 2013 P-93 does, " +
    'e.g. (2R,3S), rac-(1R,2S), (1R*,2S*), (2Z,4E).',
  'descriptor-label-mismatch':
    '{field} declares {text}, but the structure computes otherwise at {count:unit|units}: {mismatches} ({how}). ' +
    'Either the drawing or the descriptors are wrong: check the wedges / @ marks at those atoms, or correct the ' +
    'descriptors.',
  'descriptor-not-stereo-unit':
    '{field} declares configurations at {locantCount?locant|locants} {locants}, but no stereo unit of the structure carries those ' +
    'atom-map numbers (computed: {computed}). Check the atom-map numbers in the SMILES, or drop those descriptors.',
  'descriptor-at-undefined-unit':
    '{field} declares configurations at {locantCount?locant|locants} {locants}, but the structure leaves those units undefined. Draw ' +
    'the configuration the descriptors state.',
  'descriptor-counts-mismatch':
    '{field} declares {text} ({declaredCounts}), but the defined units of the structure give {computedCounts} ' +
    '({computed}). Compared as counts because {whyNotPerLocant}{invertNote}. Correct the drawing or the descriptors; ' +
    'atom-map numbers as locants ([C@@H:2]) allow a per-atom comparison.',
  'descriptors-cite-undefined-units':
    '{field} declares {text} ({declaredCount:configuration|configurations}), but the structure defines only ' +
    '{definedCount:stereo unit|stereo units} and leaves {undefinedCount} undefined, so the descriptors cannot be checked. Draw the ' +
    'configurations the descriptors state (for a racemate: one enantiomer with an AND group).',
  'descriptors-at-unstated-units':
    '{field} declares {text}: not verified. The configuration it states belongs to {openUnits}, which the ' +
    'structure as given cannot state (a SMILES has no notation for a stereogenic axis, a helix or a planar ' +
    'twist; 2D coordinates state no planar twist). Draw the unit to have the descriptors checked: an axis with ' +
    'wedges in a molfile or a CXSMILES with 2D coordinates, a helix or a planar twist with 3D coordinates.',
  'descriptors-incomplete':
    '{field} declares {text} but does not cite {missing} of the structure ({computed}). A full name cites every ' +
    'stereogenic unit (IUPAC 2013, P-93); add the missing descriptors.',
  'name-and-descriptors-disagree':
    'The name states {nameText} but stereo.descriptors states {fieldText}. Make them the same.',
  'descriptor-on-invertible-nitrogen':
    '{field} declares {text}, but the structure has no stereo unit: its only configuration is drawn at {atoms}, ' +
    'an ordinary amine nitrogen that inverts rapidly and is not a stereocentre, so the descriptors describe ' +
    'nothing that can be isolated. Drop them{seeAlso}.',
  'descriptor-remark': '{field}: {remark}.',
  'fischer-not-compared':
    '{field} uses the Fischer–Rosanoff descriptor {fischer}, which is defined by analogy with glyceraldehyde and ' +
    'is not comparable with CIP labels, so it was not checked against the structure. Add CIP descriptors, e.g. ' +
    '(S) for L-alanine, to have them checked.',
  ...unverifiedMessages,
  ...prefixMessages,
  ...cisTransMessages,
} as const;

/** How a per-atom comparison matched descriptors to units, in words. */
const HOW: Record<string, string> = {
  'per-locant': 'compared per locant through atom-map numbers',
  'per-unit':
    'matched without atom maps: the structure has one stereo unit of each kind the descriptors cite',
};

type Id = keyof typeof messages;

function countsText(c: Record<string, number>): string {
  const e = Object.entries(c).filter(([, v]) => v > 0);
  return e.length ? e.map(([k, v]) => `${v} ${k}`).join(', ') : 'no labelled units';
}

function compareOne(
  field: string,
  text: string,
  parsed: ParsedDescriptors,
  facts: StructureFacts,
  out: RawFinding[],
  form: string,
  evidence: string[],
  nitrogenNote = false,
  source?: { read: ReadStructure; text: StructureSource | null | undefined },
): DescriptorComparison | null {
  const add = (id: Id, data: RawFinding['data'], severity?: RawFinding['severity']): void => {
    out.push(finding(id, field, { field, text, ...data }, severity));
  };
  for (const p of parsed.problemDetails)
    add('descriptor-unreadable', { problem: p.message, offset: p.offset });
  // Style remarks are worth a note on stereo.descriptors (written for the registry, in IUPAC style); on a name
  // they only say how the name was read, which goes with the evidence.
  if (field === 'name') evidence.push(...parsed.remarks.map((r) => `name: ${r}`));
  else for (const r of parsed.remarks) add('descriptor-remark', { remark: r }, 'note');
  if ((parsed.fischer === 'D' || parsed.fischer === 'L') && parsed.items.length === 0)
    add('fischer-not-compared', { fischer: parsed.fischer }, 'note');
  if (parsed.items.length === 0 || parsed.problemDetails.length > 0) return null;
  const centres = facts.units.filter((u) => u.kind === 'tetrahedral' && !u.pseudoasymmetric).length;
  // '(R,S)' read as the legacy racemate but on several centres and a non-racemic form: it may mean two centres
  // without locants; the prefix finding (legacy-racemate-or-two-centres) says so, a comparison would mislead.
  if (parsed.legacyPair && centres >= 2 && form !== 'racemate') return null;
  const cmp = compareDescriptors(parsed, facts.units, { achiral: facts.chiral === false });
  const computed = labelList(facts.units);
  if (!cmp.agrees && facts.units.length === 0 && facts.invertibleNitrogens.length > 0) {
    // One root cause: the configuration is drawn on an invertible nitrogen. When nitrogen-inversion reports the
    // claim as an error this is a note beside it; otherwise (e.g. declared achiral) it is the error itself.
    add(
      'descriptor-on-invertible-nitrogen',
      {
        atoms: facts.invertibleNitrogens.map((n) => `nitrogen (atom ${n.atom})`).join(', '),
        seeAlso: nitrogenNote ? ' (nitrogen-inversion reports the claim)' : '',
        ...(nitrogenNote ? { explainedBy: NITROGEN_CHECK_ID } : {}),
      },
      nitrogenNote ? 'note' : undefined,
    );
    return cmp;
  }
  if (cmp.method === 'per-locant' || cmp.method === 'per-unit') {
    if (cmp.mismatches.length) {
      const mismatches = cmp.mismatches
        .map((m) =>
          m.locant === ''
            ? `atom ${m.atoms.join('–')}: declared ${m.declared}, computed ${m.computed}`
            : `locant ${m.locant}: declared ${m.declared}, computed ${m.computed} (atom ${m.atoms.join('–')})`,
        )
        .join('; ');
      add('descriptor-label-mismatch', {
        count: cmp.mismatches.length,
        mismatches,
        method: cmp.method,
        how: HOW[cmp.method]!,
      });
      const fix = relabelFix(field, text, parsed, cmp);
      if (fix !== null) out[out.length - 1]!.fix = fix;
    }
    if (cmp.notStereoUnits.length)
      add('descriptor-not-stereo-unit', {
        locants: cmp.notStereoUnits.join(', '),
        locantCount: cmp.notStereoUnits.length,
        computed,
      });
    if (cmp.undefinedAt.length)
      add('descriptor-at-undefined-unit', {
        locants: cmp.undefinedAt.join(', '),
        locantCount: cmp.undefinedAt.length,
      });
    if (cmp.agrees && cmp.unlisted.length) {
      const missing = cmp.unlisted
        .map((u) => `${u.locant ?? `atom ${u.atoms.join('–')}`} (${u.label})`)
        .join(', ');
      add('descriptors-incomplete', { missing, computed, method: cmp.method }, 'warning');
    }
    return cmp;
  }
  if (parsed.embeddedDescriptors) return cmp; // the name cites more units further in; counts would mislead
  const definedCount = Object.values(cmp.computedCounts).reduce((a, b) => a + b, 0);
  if (!cmp.agrees && facts.undefined > 0 && parsed.items.length > definedCount) {
    if (parsed.mode === 'racemic' && form === 'racemate' && definedCount === 0) {
      // A racemate drawn flat (common practice, accepted by form-matches-structure): nothing to compare.
      evidence.push(`${text} names a racemate; the drawing shows no configuration, as usual for a racemate`);
      return null;
    }
    const open = facts.units.filter((u) => u.formatCannotState);
    if (open.length > 0 && open.length === facts.undefined) {
      add('descriptors-at-unstated-units', { openUnits: listUnits(open) }, 'note');
      return cmp;
    }
    // A racemate drawn without stereo marks is common practice; other claims should draw what they state.
    add(
      'descriptors-cite-undefined-units',
      {
        undefinedCount: facts.undefined,
        declaredCount: parsed.items.length,
        definedCount,
        mode: parsed.mode,
      },
      parsed.mode === 'racemic' ? 'note' : undefined,
    );
    return cmp;
  }
  if (cmp.agrees && !cmp.countsDecide) {
    const mapped = source
      ? withAtomMaps(source.read.structure, source.text, [...new Set(facts.units.flatMap((u) => u.atoms))])
      : null;
    out.push(unverifiedFinding(field, text, parsed, facts, cmp, mapped));
  }
  if (!cmp.agrees) {
    const subset = (d: Record<string, number>): boolean =>
      Object.entries(d).every(([k, v]) => v <= (cmp.computedCounts[k] ?? 0));
    const inv = Object.fromEntries(
      Object.entries(cmp.declaredCounts).map(([k, v]) => [
        ({ R: 'S', S: 'R', M: 'P', P: 'M' } as Record<string, string>)[k] ?? k,
        v,
      ]),
    );
    const mayInvert = parsed.mode === 'racemic' || parsed.mode === 'relative';
    const direct = subset(cmp.declaredCounts);
    if (direct || (mayInvert && subset(inv))) {
      const used = direct ? cmp.declaredCounts : inv;
      const rest: Record<string, number> = {};
      for (const [k, v] of Object.entries(cmp.computedCounts)) rest[k] = v - (used[k] ?? 0);
      add('descriptors-incomplete', { missing: countsText(rest), computed, method: cmp.method }, 'warning');
    } else {
      add('descriptor-counts-mismatch', {
        declaredCounts: countsText(cmp.declaredCounts),
        computedCounts: countsText(cmp.computedCounts),
        computed,
        whyNotPerLocant: cmp.whyNotPerLocant ?? '',
        invertNote: mayInvert
          ? '; relative/racemic descriptors were also tried against the mirror image'
          : '',
        method: cmp.method,
      });
      const fix = singleLabelFix(field, text, parsed, facts.units);
      if (fix !== null) out[out.length - 1]!.fix = fix;
    }
  }
  return cmp;
}

/** The same configurations: locant by locant when both cite locants, else the same labels in any order. */
function sameItems(a: ParsedDescriptors, b: ParsedDescriptors): boolean {
  const withLocants = a.items.every((i) => i.locant !== null) && b.items.every((i) => i.locant !== null);
  const k = (p: ParsedDescriptors): string =>
    p.mode +
    '|' +
    p.items
      .map((i) => `${withLocants ? i.locant : ''}${i.pair ?? i.label}${i.relativeStar ? '*' : ''}`)
      .sort()
      .join(',');
  return k(a) === k(b);
}

/**
 * The facts to compare descriptors with: a component of a salt that repeats an earlier one (same constitution
 * and configuration, e.g. the two amphetamines of bis(amphetamine) sulfate) is cited once, so its units are
 * left out. `repeats` says so in words for the evidence.
 */
function comparable(r: ReadStructure, ctx: CheckContext): { facts: StructureFacts; repeats: string } | null {
  const f = r.facts;
  if (!f) return null;
  const repeated = repeatedComponents(r.structure, f, ctx.engine);
  if (repeated.size === 0) return { facts: f, repeats: '' };
  const units = distinctUnits(f, repeated);
  const words = [...repeated].map(([k, j]) => `component ${k + 1} repeats component ${j + 1}`).join(', ');
  return {
    facts: { ...f, units, undefined: units.filter((u) => !u.defined).length },
    repeats: ` (${words} of the structure and is counted once)`,
  };
}

function run(ctx: CheckContext): CheckOutcome {
  const record = ctx.record;
  const c0 = comparable(ctx.main, ctx);
  if (!record || !c0) return { findings: [], notApplicable: 'the record or its structure was not read' };
  const f = c0.facts;
  const decl = declaredDescriptors(record);
  const out: RawFinding[] = [];
  const evidence: string[] = [];
  const note = (
    what: string,
    cmp: DescriptorComparison | null,
    compared: StructureFacts = f,
    repeats = c0.repeats,
  ): void => {
    if (!cmp || cmp.method === 'none') return;
    const how =
      cmp.method === 'per-locant'
        ? 'per locant (atom maps)'
        : cmp.method === 'per-unit'
          ? 'per unit (one stereo unit of each kind cited, matched without atom maps)'
          : cmp.countsDecide
            ? `as counts (${cmp.whyNotPerLocant}; every matching of locants to units gives the same labels)`
            : `as counts only, not verified per atom (${cmp.whyNotPerLocant})`;
    const verb = cmp.method === 'counts' && !cmp.countsDecide ? 'is consistent in count with' : 'agrees with';
    evidence.push(
      `${what} ${verb} computed ${labelList(compared.units)}${repeats}, compared ${how}${cmp.matchedInverted ? ', up to inversion' : ''}`,
    );
  };
  const fieldText = record.stereo.descriptors ?? '';
  const mainSource = {
    read: ctx.main,
    text: ctx.loaded.sources?.main ?? {
      field: 'structure',
      format: 'smiles' as const,
      text: record.structure.smiles ?? null,
    },
  };
  const nitrogenNote = claimRestsOnlyOnNitrogen(ctx);
  const form = record.stereo.form;
  if (decl.field)
    note(
      fieldText,
      compareOne(
        'stereo.descriptors',
        fieldText,
        decl.field,
        f,
        out,
        form,
        evidence,
        nitrogenNote,
        mainSource,
      ),
    );
  if (decl.name && decl.name.items.length > 0) {
    if (decl.field && decl.field.items.length > 0 && !sameItems(decl.field, decl.name)) {
      const nameText = (record.name ?? '')
        .slice(0, (record.name ?? '').length - decl.name.rest.length)
        .replace(/[-\s]+$/, '');
      out.push(finding('name-and-descriptors-disagree', 'name', { nameText, fieldText }, 'warning'));
    } else if (!decl.field || decl.field.items.length === 0) {
      const name = record.name ?? '';
      const front = name
        .slice(0, name.length - decl.name.rest.length)
        .replace(/[-\s\u2010-\u2014\u2212\uFE63\uFF0D\u02D7]+$/, '');
      note(front, compareOne('name', front, decl.name, f, out, form, evidence, nitrogenNote, mainSource));
    }
  } else if (decl.name) {
    for (const p of decl.name.problemDetails) {
      out.push(
        finding('descriptor-unreadable', 'name', {
          field: 'name',
          text: record.name ?? '',
          problem: p.message,
          offset: p.offset,
        }),
      );
    }
    if ((decl.name.fischer === 'D' || decl.name.fischer === 'L') && !decl.field) {
      out.push(
        finding('fischer-not-compared', 'name', { field: 'name', fischer: decl.name.fischer }, 'note'),
      );
    }
  }
  (record.stereo.components ?? []).forEach((c, i) => {
    const cc = ctx.components[i] ? comparable(ctx.components[i], ctx) : null;
    if (!c.descriptors || !cc) return;
    const field = `stereo.components.${i}.descriptors`;
    const cf = cc.facts;
    note(
      `component ${i + 1} ${c.descriptors}`,
      compareOne(
        field,
        c.descriptors,
        parseDescriptors(c.descriptors),
        cf,
        out,
        'component',
        evidence,
        false,
        {
          read: ctx.components[i]!,
          text: ctx.loaded.sources?.components[i] ?? { field, format: 'smiles', text: c.smiles ?? null },
        },
      ),
      cf,
      cc.repeats,
    );
  });
  out.push(...prefixFindings(ctx, decl, f));
  out.push(...cisTransFindings(ctx, decl, f));
  const hasAny =
    decl.field !== null ||
    (decl.name !== null &&
      (decl.name.items.length > 0 ||
        decl.name.mode !== 'none' ||
        decl.name.words.length > 0 ||
        decl.name.rotationSign !== null));
  const hasComponents = (record.stereo.components ?? []).some((c) => c.descriptors);
  if (!hasAny && !hasComponents && out.length === 0)
    return {
      findings: [],
      notApplicable: 'no descriptors declared (stereo.descriptors, the name, the components)',
    };
  if (out.some((x) => x.severity !== 'note' || x.messageId === 'descriptors-at-unstated-units'))
    return { findings: out };
  return { findings: out, passed: evidence.join('; ') || 'descriptor prefixes agree with the declared form' };
}

export const descriptorsMatchStructure: CheckModule = {
  id: 'descriptors-match-structure',
  defaultSeverity: 'error',
  summary:
    'Stated IUPAC stereodescriptors agree with the computed CIP labels, and their prefixes with the form.',
  explanation:
    'Stereodescriptors follow the IUPAC 2013 recommendations, P-93: R/S for stereocentres (lower-case r/s for ' +
    'pseudoasymmetric ones), E/Z for double bonds, M/P or Ra/Sa for axes; RS/SR and rac- for racemates, R*/S* and ' +
    'rel- for relative configuration, which describe the drawn stereoisomer or its mirror image and are compared ' +
    'up to inversion. The labels are computed by the CIP sequence rules (P-92). When the SMILES carries atom-map ' +
    'numbers equal to the locants ([C@@H:2]) the comparison is per atom; without them a descriptor is still matched ' +
    'to its unit where the structure has one unit of each kind cited (one R/S centre, one E/Z double bond); ' +
    'otherwise only the numbers of R, S, E, Z … can be compared, and where that cannot tell (1R,2S) from (1S,2R) ' +
    'the claim is reported as consistent in count, not verified per atom (a note with the structure written with ' +
    'atom maps to paste), never as passed. (+)/(−) state the sign of optical rotation, (±) a racemate; D/L (Fischer) are not CIP ' +
    'descriptors and are not compared. cis/trans in a name is compared with the drawn geometry where it is ' +
    'unambiguous: one stereogenic double bond with one substituent other than hydrogen at each end, and no other ' +
    'stereo unit.',
  messages,
  requires: ['structure'],
  run,
};
