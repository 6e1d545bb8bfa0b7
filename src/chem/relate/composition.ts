/**
 * What one drawing holds, for relating it to another: its components (connected molecules) in their
 * charge-neutral form (neutral.ts), grouped into species — one per distinct stereoisomer of a constitution,
 * with how many copies the drawing has. A 2:1 salt has two copies of one parent species; a racemate drawn
 * explicitly has two species of one constitution.
 */
import { connectedComponents, constitutionKey, isomorphic, molecularFormula } from '../graph/index.js';
import { analyse, carryOnto, type Analysis } from '../describe/index.js';
import { extractAtoms, normalize } from '../normalize.js';
import { elementMapping } from '../symmetry/index.js';
import type { Structure } from '../types.js';
import { writeSmiles } from '../write/smiles.js';
import { neutralise } from './neutral.js';

export interface Species {
  /** Constitution key of the neutral form. */
  key: string;
  /** Constitution key of the component as drawn (differs from `key` for an ion or zwitterion). */
  drawnKey: string;
  formula: string;
  /** Atoms of the first copy, in the side's neutral structure. */
  atoms: number[];
  copies: number;
  /** The first copy in neutral form, and its analysis (made on first use). */
  structure: Structure;
  analysis: () => Analysis;
  /** The first copy as drawn, and its analysis (made on first use). */
  drawnStructure: Structure;
  drawnAnalysis: () => Analysis;
  /** The component as drawn, as SMILES (for lists of counter-ions). */
  drawnSmiles: () => string;
  /** Net charge and the charges drawn (a zwitterion has both signs). */
  charge: number;
  positive: boolean;
  negative: boolean;
  organic: boolean;
  heavy: number;
}

export interface Composition {
  /** The normalised drawing in neutral form, and as drawn: species atoms index into both. */
  neutral: Structure;
  drawn: Structure;
  species: Species[];
  /** Index of the parent species: the largest organic one (else the largest). */
  parent: number;
}

export function composition(input: Structure): Composition {
  const drawn = normalize(input).structure;
  const neutral = neutralise(drawn).structure;
  const comps = connectedComponents(neutral);
  const species: Species[] = [];
  for (const c of comps) {
    const sub = comps.length === 1 ? neutral : extractAtoms(neutral, c);
    const drawnSub = comps.length === 1 ? drawn : extractAtoms(drawn, c);
    const key = constitutionKey(sub);
    let memo: Analysis | null = null;
    const analysis = (): Analysis => (memo ??= analyse(sub));
    const same = species.find(
      (x) => x.key === key && x.atoms.length === c.length && sameConfiguration(x, sub, analysis),
    );
    if (same) {
      same.copies++;
      continue;
    }
    let drawnMemo: Analysis | null = null;
    let smiles: string | null = null;
    const charges = c.map((x) => drawn.atoms[x].charge);
    species.push({
      key,
      drawnKey: drawnSub === sub ? key : constitutionKey(drawnSub),
      formula: molecularFormula(sub),
      atoms: c,
      copies: 1,
      structure: sub,
      analysis,
      drawnStructure: drawnSub,
      drawnAnalysis: () => (drawnSub === sub ? analysis() : (drawnMemo ??= analyse(drawnSub))),
      drawnSmiles: () => (smiles ??= writeSmiles(drawnSub)),
      charge: charges.reduce((x, y) => x + y, 0),
      positive: charges.some((q) => q > 0),
      negative: charges.some((q) => q < 0),
      organic: c.some((x) => neutral.atoms[x].atomicNumber === 6),
      heavy: c.filter((x) => neutral.atoms[x].atomicNumber !== 1).length,
    });
  }
  let parent = 0;
  species.forEach((x, k) => {
    const p = species[parent];
    if ((x.organic && !p.organic) || (x.organic === p.organic && x.heavy > p.heavy)) parent = k;
  });
  return { neutral, drawn, species, parent };
}

/** Is `sub` the same stereoisomer as species x (same constitution known)? Undefined stereo is never the same. */
function sameConfiguration(x: Species, sub: Structure, analysis: () => Analysis): boolean {
  if (x.structure.stereo.length + sub.stereo.length === 0) return true;
  const pa = x.analysis();
  const pb = analysis();
  const iso = isomorphic(pa.p.structure, pb.p.structure);
  if (!iso) return false;
  const c = carryOnto(pa, pb, iso);
  return !c.open && elementMapping(pb.group, c.y, pb.state) >= 0;
}

/** Does the species have stereo units (potential ones count: a constitution that can be chiral)? */
export function hasUnits(x: Species): boolean {
  return x.analysis().p.units.length > 0;
}

/** "a zwitterion", "a cation", "an anion" or "neutral": how a component is drawn. */
export function drawnAs(x: Species): string {
  if (x.positive && x.negative && x.charge === 0) return 'a zwitterion';
  if (x.charge > 0) return 'a cation';
  if (x.charge < 0) return 'an anion';
  return x.positive || x.negative ? 'charge-separated' : 'neutral';
}
