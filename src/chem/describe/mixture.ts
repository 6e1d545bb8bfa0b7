/**
 * A drawing that holds several stereoisomers of the parent's constitution as separate molecules — a racemate
 * drawn out as (R)- and (S)-lactic acid, a 1:1 mixture of two diastereomers — is a mixture, not one molecular
 * entity: it has no "meso" form (Gold Book: meso is an achiral member of a set of diastereoisomers, one
 * molecule), and its stereoisomer count is that of one molecule. The facts then say:
 *   - stereoisomers: the count for one molecule of the parent (with the other components);
 *   - chiral: true when some molecule drawn is chiral (a racemate consists of chiral molecules), false when
 *     none is, null when that is open;
 *   - meso: only when every molecule drawn is achiral and the constitution has chiral stereoisomers;
 *   - mixture: what the drawing is (racemate: two enantiomers in equal numbers, IUPAC Gold Book "racemate").
 */
import type { MixtureFacts } from '../facts.js';
import { constitutionKey, molecularFormula } from '../graph/index.js';
import { extractAtoms } from '../normalize.js';
import { mirror } from '../symmetry/index.js';
import type { Structure } from '../types.js';
import { analyse } from './analyse.js';
import { sameStereoisomer } from './carry.js';

export interface DrawnMixture {
  facts: MixtureFacts;
  /** Components of the parent's constitution beyond the parent itself (copies and other stereoisomers). */
  beyondParent: number[];
  /** Chirality of each stereoisomer drawn (null: open). */
  chiral: (boolean | null)[];
}

interface Kind {
  structure: Structure;
  count: number;
}

export function drawnMixture(
  s: Structure,
  comps: number[][],
  parent: number,
  copies: number[],
): DrawnMixture | null {
  if (parent < 0 || comps.length < 2) return null;
  const ps = extractAtoms(s, comps[parent]);
  const key = constitutionKey(ps);
  const kinds: Kind[] = [{ structure: ps, count: 1 + copies.length }];
  const beyondParent = [...copies];
  comps.forEach((c, k) => {
    if (k === parent || copies.includes(k) || c.length !== comps[parent].length) return;
    const cs = extractAtoms(s, c);
    if (constitutionKey(cs) !== key) return;
    beyondParent.push(k);
    const same = kinds.find((x) => sameStereoisomer(x.structure, cs));
    if (same) same.count++;
    else kinds.push({ structure: cs, count: 1 });
  });
  if (kinds.length < 2) return null;
  const chiral = kinds.map((x) => analyse(x.structure).chirality.chiral);
  const enantiomeric = (i: number, j: number): boolean =>
    sameStereoisomer(mirror(kinds[i].structure), kinds[j].structure);
  let pairs = 0;
  for (let i = 0; i < kinds.length; i++)
    for (let j = i + 1; j < kinds.length; j++) if (enantiomeric(i, j)) pairs++;
  const formula = molecularFormula(ps);
  const counts = kinds.map((x) => x.count);
  let kind: MixtureFacts['kind'];
  let explanation: string;
  if (kinds.length === 2 && pairs === 1) {
    kind = counts[0] === counts[1] ? 'racemate' : 'enantiomers';
    explanation =
      kind === 'racemate'
        ? `the drawing holds both enantiomers of ${formula} in equal numbers: a racemate drawn out (IUPAC Gold Book), whose molecules are chiral`
        : `the drawing holds both enantiomers of ${formula} in unequal numbers (${counts.join(':')})`;
  } else if (pairs === 0) {
    kind = 'diastereomers';
    explanation = `the drawing holds ${kinds.length} diastereomers of ${formula} (${counts.join(':')})`;
  } else {
    kind = 'stereoisomers';
    explanation = `the drawing holds ${kinds.length} stereoisomers of ${formula} (${counts.join(':')}), among them enantiomers`;
  }
  return { facts: { kind, stereoisomers: kinds.length, ratio: counts, explanation }, beyondParent, chiral };
}
