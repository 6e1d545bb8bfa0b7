/**
 * The cis/trans part of descriptors-match-structure: a name that calls a compound cis- or trans- against the
 * drawn geometry of its double bond.
 *
 * Judged only where the word is unambiguous: the structure has exactly one stereogenic double bond, no other
 * stereo unit (a ring's cis/trans would be about its stereocentres), and each end of the double bond carries
 * exactly one substituent other than hydrogen, so "cis" can only mean "those two substituents on the same side".
 * For such a 1,2-disubstituted double bond cis is Z and trans is E whatever the substituents, since each end has
 * only one ligand that can outrank hydrogen (CIP Rule 1a). IUPAC 2013 (P-93.4.2.1.1, from memory) prefers E/Z for
 * double bonds; cis/trans is still common in legacy names, which is why it is worth checking.
 */
import type { StructureFacts } from '../chem/facts.js';
import { IMPLICIT_H, type DoubleBondStereo, type Structure } from '../chem/types.js';
import type { CheckContext, RawFinding } from './types.js';
import { finding, type DeclaredDescriptors } from './words.js';

export const cisTransMessages = {
  'cis-trans-word-contradicts-drawing':
    'The name calls the compound {word}, but the drawing puts the substituents of the double bond {ends} ' +
    '({subs}) {drawn}, which is {label}. Correct the drawing (the / and \\ marks or the wedges) or the name; ' +
    'E/Z descriptors say it without ambiguity.',
  'cis-trans-word-on-undefined-bond':
    'The name calls the compound {word}, but the drawing leaves the double bond {ends} undefined. Draw the ' +
    '{word} geometry (e.g. C/C=C{mark}C in SMILES), or drop the word if the geometry is unknown.',
} as const;

interface Judged {
  ends: [number, number];
  /** Input numbers of the one non-hydrogen substituent at each end. */
  subs: [number, number];
  /** Where those substituents lie as drawn; null when the bond is undefined. */
  drawn: 'cis' | 'trans' | null;
}

/** The one double bond whose cis/trans a name can state unambiguously, or null. */
export function judgedDoubleBond(s: Structure, facts: StructureFacts): Judged | null {
  if (facts.units.length !== 1 || facts.units[0].kind !== 'double-bond') return null;
  const unit = facts.units[0];
  const index = new Map(s.atoms.map((a, i) => [a.inputNumber, i]));
  const a = index.get(unit.atoms[0]);
  const b = index.get(unit.atoms[1]);
  if (a === undefined || b === undefined) return null;
  const heavyOther = (end: number, other: number): number[] => {
    const out: number[] = [];
    for (const bond of s.bonds) {
      const n = bond.a === end ? bond.b : bond.b === end ? bond.a : -1;
      if (n >= 0 && n !== other && s.atoms[n].atomicNumber !== 1) out.push(n);
    }
    return out;
  };
  const sa = heavyOther(a, b);
  const sb = heavyOther(b, a);
  if (sa.length !== 1 || sb.length !== 1) return null;
  const el = s.stereo.find(
    (x): x is DoubleBondStereo =>
      x.kind === 'double-bond' &&
      ((x.ends[0] === a && x.ends[1] === b) || (x.ends[0] === b && x.ends[1] === a)),
  );
  let drawn: Judged['drawn'] = null;
  if (el && unit.defined) {
    // refs[k] sits on ends[k]; a ref that is not the heavy substituent (a hydrogen) flips the relation
    const heavyAt = (end: number) => (end === a ? sa[0] : sb[0]);
    let flips = 0;
    for (const k of [0, 1] as const)
      if (el.refs[k] === IMPLICIT_H || el.refs[k] !== heavyAt(el.ends[k])) flips++;
    const same = el.relation === 'cis';
    drawn = same === (flips % 2 === 0) ? 'cis' : 'trans';
  }
  return {
    ends: [unit.atoms[0], unit.atoms[1]],
    subs: [s.atoms[sa[0]].inputNumber, s.atoms[sb[0]].inputNumber],
    drawn,
  };
}

export function cisTransFindings(
  ctx: CheckContext,
  decl: DeclaredDescriptors,
  facts: StructureFacts,
): RawFinding[] {
  const words = decl.name?.words ?? [];
  const said = words.includes('cis') ? 'cis' : words.includes('trans') ? 'trans' : null;
  if (said === null || (words.includes('cis') && words.includes('trans'))) return [];
  const s = ctx.main.structure;
  if (!s) return [];
  const j = judgedDoubleBond(s, facts);
  if (!j) return [];
  const ends = `between atoms ${j.ends[0]} and ${j.ends[1]}`;
  if (j.drawn === null) {
    return [
      finding(
        'cis-trans-word-on-undefined-bond',
        'name',
        { word: said, ends, mark: said === 'cis' ? '\\' : '/' },
        'warning',
      ),
    ];
  }
  if (j.drawn === said) return [];
  return [
    finding('cis-trans-word-contradicts-drawing', 'name', {
      word: said,
      ends,
      subs: `atoms ${j.subs[0]} and ${j.subs[1]}`,
      drawn: j.drawn === 'cis' ? 'on the same side: cis' : 'on opposite sides: trans',
      label: j.drawn === 'cis' ? 'Z' : 'E',
    }),
  ];
}
