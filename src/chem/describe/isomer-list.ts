/**
 * The stereoisomer list of a constitution: one entry per orbit (isomers/ enumerateStereoisomers), written as
 * SMILES with its CIP labels. Units that are not stereogenic in an entry (C3 of the (2R,4R) form of
 * 2,3,4-trihydroxyglutaric acid) are written without a configuration.
 */
import type { StereoisomerEntry } from '../facts.js';
import type { Analysis } from './analyse.js';
import { enumerateStereoisomers } from '../isomers/index.js';
import { labelUnits } from '../labels.js';
import { unitStereo } from '../perceive/index.js';
import { canonicalState, sameState, stereogenicIn } from '../symmetry/index.js';
import type { Structure } from '../types.js';
import { withStereo } from '../read/make.js';
import { writeSmiles } from '../write/smiles.js';

export function listStereoisomers(a: Analysis, max: number): StereoisomerEntry[] {
  const { p, group } = a;
  const s = p.structure;
  const n = s.atoms.length;
  const m = p.units.length;
  const fully = a.defined.every((d) => d === 1);
  const inputCanon = fully ? canonicalState(group, a.state) : null;
  return enumerateStereoisomers(group, m, max).map(({ state, chiral }) => {
    const stereo = p.units.flatMap((u, k) => {
      const e = stereogenicIn(group, state, k) ? unitStereo(u, state[k], n) : null;
      return e === null ? [] : [e];
    });
    const t: Structure = withStereo(s, stereo, []);
    const labels = labelUnits(t).map((r) => ({
      atoms: r.atoms.map((x) => s.atoms[x].inputNumber),
      label: r.label,
    }));
    labels.sort((x, y) => x.atoms[0] - y.atoms[0]);
    return {
      smiles: writeSmiles(t),
      labels,
      chiral,
      isInput: inputCanon !== null && sameState(inputCanon, state),
    };
  });
}
