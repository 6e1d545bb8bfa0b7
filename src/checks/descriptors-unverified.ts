/**
 * The unverified part of descriptors-match-structure: descriptors that agree with the structure in count only.
 * Without atom-map numbers the locants of (1R,2S) cannot be matched to atoms, so a count comparison cannot tell
 * (1R,2S) from (1S,2R) — ephedrine from its enantiomer's descriptors. That is a note (not a pass) naming what is
 * missing, with the fix: the structure written with atom maps on its stereo units, to be pasted back with each
 * map number changed to the locant the name gives that atom. A registry that wants such records held back raises
 * the note: `severities: {descriptors-match-structure/descriptors-not-verified-per-atom: warning}`.
 */
import type { DescriptorComparison, ParsedDescriptors } from '../chem/descriptors.js';
import type { StereoUnitFact, StructureFacts } from '../chem/facts.js';
import type { MappedStructure } from './mapped-smiles.js';
import type { RawFinding } from './types.js';
import { finding, labelList } from './words.js';

export const UNVERIFIED_ID = 'descriptors-not-verified-per-atom';

export const unverifiedMessages = {
  [UNVERIFIED_ID]:
    '{field} states {text}: consistent in count with the structure ({computed}), not verified per atom — the ' +
    'structure carries no atom-map numbers, so the locants cannot be matched to atoms{fitsIf}. To have it ' +
    'checked per atom, paste the structure with the locants as atom maps: {paste} ({numbering}; change ' +
    'each map number to the locant the name gives that atom, e.g. [C@@H:2] for C2).',
} as const;

/** ", and they fit the drawing only if locant 1 is atom 5 and locant 2 is atom 2" when that is one reading. */
function fitsIf(parsed: ParsedDescriptors, units: readonly StereoUnitFact[], mayInvert: boolean): string {
  if (mayInvert || parsed.items.some((it) => it.locant === null)) return '';
  const defined = units.filter((u) => u.defined && u.label !== null);
  const reading: string[] = [];
  for (const it of parsed.items) {
    const candidates = defined.filter((u) => u.label === it.label);
    if (candidates.length !== 1) return '';
    reading.push(`locant ${it.locant} is atom ${candidates[0]!.atoms[0]}`);
  }
  return reading.length > 1 ? `; they fit the drawing only if ${reading.join(' and ')}` : '';
}

export function unverifiedFinding(
  field: string,
  text: string,
  parsed: ParsedDescriptors,
  facts: StructureFacts,
  cmp: DescriptorComparison,
  mapped: MappedStructure | null,
): RawFinding {
  const mayInvert = parsed.mode === 'racemic' || parsed.mode === 'relative' || facts.chiral === false;
  const stereoAtoms = [...new Set(facts.units.flatMap((u) => u.atoms))].sort((a, b) => a - b);
  return finding(
    UNVERIFIED_ID,
    field,
    {
      field,
      text,
      computed: labelList(facts.units),
      fitsIf: fitsIf(parsed, facts.units, mayInvert),
      mappedSmiles: mapped?.smiles ?? null,
      paste: mapped?.smiles ?? `your structure with atom maps on atoms ${stereoAtoms.join(', ')}`,
      numbering: mapped?.numbering ?? 'atom-map numbers on the atoms of the stereo units',
      atoms: stereoAtoms.join(', '),
      method: cmp.method,
    },
    'note',
  );
}
