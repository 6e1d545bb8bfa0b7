/**
 * Invariants of the stereo engine as property tests (fast-check, seeded, bounded) over real structures — MoleculeNet
 * (Wu et al., Chem. Sci. 2018, 9, 513–530) and the CIP validation suite (Hanson et al., J. Chem. Inf. Model. 2018,
 * 58, 1755) — and over mutated and combined versions of them:
 *   - a fully defined chiral structure related to its own mirror image is "enantiomers", an achiral one
 *     "identical" (IUPAC Gold Book, "chirality": not superimposable on its mirror image), salts and mixtures
 *     included;
 *   - writing a structure as SMILES and reading it back changes no fact.
 * Independent reference: RDKit MinimalLib (@rdkit/rdkit) — a drawing is achiral as a whole when its canonical
 * SMILES equals that of its mirror image (@/@@ swapped), which holds for multi-component drawings too.
 */
import fc from 'fast-check';
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import type { StructureFacts } from '../../src/chem/facts.js';
import { parseSmiles } from '../../src/chem/read/smiles.js';
import { relate } from '../../src/chem/relate.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import type { Structure } from '../../src/chem/types.js';
import { writeSmiles } from '../../src/chem/write/smiles.js';
import { haveSharedData } from '../support/shared-data.js';
import { loadMoleculeNet } from '../support/moleculenet.js';
import { loadSdf, loadSmiles } from './cip/suite.js';
import { loadRdkit } from './graph/rdkit.js';

// INVARIANT_SEED / INVARIANT_SCALE widen a local run (npm test uses the fixed seed and the default bounds)
const SEED = Number(process.env.INVARIANT_SEED ?? 20261202);
const SCALE = Number(process.env.INVARIANT_SCALE ?? 1);
const have = haveSharedData('moleculenet') && haveSharedData('cip-validation-suite');

interface Item {
  id: string;
  structure: Structure;
}

function read(smiles: string): Structure | null {
  const r = parseSmiles(smiles);
  return r.ok ? r.structure : null;
}

function pool(): Item[] {
  if (!have) return [];
  const out: Item[] = [];
  for (const row of loadMoleculeNet()) {
    if (!/[@/\\]/.test(row.smiles) && !row.smiles.includes('.')) continue;
    const s = read(row.smiles);
    if (s) out.push({ id: `${row.file}:${row.row}`, structure: s });
  }
  for (const r of [...loadSmiles(), ...loadSdf('compounds_2d.sdf')])
    if (r.structure) out.push({ id: r.id, structure: r.structure });
  return out;
}

const items = pool();

/**
 * What the mirror image of a fully defined drawing must be related as; null when the facts leave it open. A
 * drawing of several stereoisomers of one constitution (f.mixture) says through `chiral` whether its molecules
 * are chiral, not the drawing as a whole: its mirror relation is tested apart (the racemate drawn out).
 */
function expectedMirrorRelation(f: StructureFacts): 'enantiomers' | 'identical' | null {
  if (f.undefined > 0 || f.chiral === null || f.mixture) return null;
  return f.chiral ? 'enantiomers' : 'identical';
}

/** The facts that do not depend on atom order or numbering. */
function orderFree(f: StructureFacts): unknown {
  return {
    chiral: f.chiral,
    meso: f.meso,
    undefined: f.undefined,
    stereoisomers: f.stereoisomers,
    labels: f.units.map((u) => `${u.kind}:${u.label}:${u.defined}:${u.pseudoasymmetric}`).sort(),
    constitutionKey: f.constitutionKey,
    formula: f.formula,
    mixture: f.mixture?.kind ?? null,
    mirrorChiral: f.mirror.chiral,
  };
}

/** Mutations a registry meets: stereo inverted at random, a radical, an isotope, a counter-ion, a second molecule. */
function mutated(s: Structure, kind: number, bits: number, other: Structure): Structure | null {
  const atoms = s.atoms;
  const at = bits % Math.max(1, atoms.length);
  let smiles: string;
  if (kind === 0) {
    let k = 0;
    const stereo = s.stereo.map((e) =>
      e.kind !== 'double-bond' && (bits >> (k++ % 30)) & 1
        ? { ...e, winding: e.winding === '@' ? ('@@' as const) : ('@' as const) }
        : e,
    );
    smiles = writeSmiles({ ...s, stereo });
  } else if (kind === 1) {
    // a radical where an H was: the atom written in brackets with one H fewer
    const a = atoms[at];
    if (!a || a.hCount === 0) return null;
    smiles = writeSmiles({
      ...s,
      atoms: atoms.map((x, i) => (i === at ? { ...x, hCount: x.hCount - 1, radical: 1 } : x)),
    });
  } else if (kind === 2) {
    smiles = writeSmiles({
      ...s,
      atoms: atoms.map((x, i) =>
        i === at ? { ...x, isotope: x.atomicNumber === 6 ? 13 : 2 * x.atomicNumber + 1 } : x,
      ),
    });
  } else if (kind === 3) {
    smiles = `${writeSmiles(s)}.${['[Na+]', 'Cl', '[Cl-]', 'OS(=O)(=O)O', 'O'][bits % 5]}`;
  } else if (kind === 4) {
    smiles = `${writeSmiles(s)}.${writeSmiles(bits & 1 ? mirror(other) : other)}`;
  } else {
    // the same molecule twice, once mirrored or not: a racemate drawn out, or a 2:1 drawing
    smiles = `${writeSmiles(s)}.${writeSmiles(bits & 1 ? mirror(s) : s)}`;
  }
  return read(smiles);
}

const anyItem = fc.integer({ min: 0, max: Math.max(0, items.length - 1) });

suite.skipIf(!have)('engine invariants over real and mutated structures', () => {
  it('relate(x, mirror(x)) is "enantiomers" for chiral x and "identical" for achiral x (real structures)', () => {
    fc.assert(
      fc.property(anyItem, (k) => {
        const { id, structure } = items[k];
        const want = expectedMirrorRelation(describe(structure));
        if (want === null) return;
        expect(`${id}: ${relate(structure, mirror(structure)).relation}`).toBe(`${id}: ${want}`);
      }),
      { numRuns: 250 * SCALE, seed: SEED },
    );
  });

  it('the same over mutated structures: inverted centres, radicals, isotopes, counter-ions, mixtures', () => {
    fc.assert(
      fc.property(anyItem, anyItem, fc.integer({ min: 0, max: 5 }), fc.nat(), (k, j, kind, bits) => {
        const s = mutated(items[k].structure, kind, bits, items[j].structure);
        if (!s) return;
        const f = describe(s);
        // x with its mirror image drawn beside it is a racemate drawn out (or an achiral molecule twice): its
        // mirror image is the same drawing
        const racemic = kind === 5 && (bits & 1) === 1;
        const want = racemic ? (f.undefined > 0 ? null : 'identical') : expectedMirrorRelation(f);
        if (want === null) return;
        const what = `${items[k].id} mutation ${kind} (${writeSmiles(s)})`;
        expect(`${what}: ${relate(s, mirror(s)).relation}`).toBe(`${what}: ${want}`);
      }),
      { numRuns: 150 * SCALE, seed: SEED + 1 },
    );
  });

  it('writing a structure as SMILES and reading it back changes no fact (real and mutated structures)', () => {
    fc.assert(
      fc.property(anyItem, anyItem, fc.integer({ min: -1, max: 5 }), fc.nat(), (k, j, kind, bits) => {
        const s = kind < 0 ? items[k].structure : mutated(items[k].structure, kind, bits, items[j].structure);
        if (!s) return;
        // a biaryl axis read from a molfile's wedges has no SMILES notation here yet: left out
        if (s.stereo.some((e) => e.kind === 'axial' && e.subtype === 'biaryl')) return;
        const w = writeSmiles(s);
        const back = read(w);
        expect(back, `${items[k].id}: ${w} does not read back`).not.toBeNull();
        expect({ id: items[k].id, smiles: w, facts: orderFree(describe(back!)) }).toEqual({
          id: items[k].id,
          smiles: w,
          facts: orderFree(describe(s)),
        });
      }),
      { numRuns: 200 * SCALE, seed: SEED + 2 },
    );
  });

  it('a radical the bracket atom cannot imply survives the round trip (CXSMILES ^1)', () => {
    const s = read('[SbH5+3]')!;
    const rad: Structure = { ...s, atoms: [{ ...s.atoms[0], radical: 1 }] };
    expect(writeSmiles(rad)).toBe('[SbH5+3] |^1:0|');
    expect(read(writeSmiles(rad))!.atoms[0].radical).toBe(1);
    expect(read('[CH3]')!.atoms[0].radical).toBe(1); // implied by the bracket: no block needed
    expect(writeSmiles(read('[CH3]')!)).toBe('[CH3]');
  });

  it('multi-component drawings: achiral as a whole exactly when RDKit finds the mirror canonical SMILES equal', async () => {
    const rd = await loadRdkit();
    const canonical = (x: string): string | null => {
      const m = rd.get_mol(x);
      if (!m) return null;
      const out = m.get_smiles();
      m.delete();
      return out;
    };
    const swap = (x: string): string => x.replace(/@@|@/g, (t) => (t === '@@' ? '@' : '@@'));
    const disagree: string[] = [];
    let compared = 0;
    for (const row of loadMoleculeNet()) {
      if (!row.smiles.includes('.') || !row.smiles.includes('@')) continue;
      const s = read(row.smiles);
      if (!s || expectedMirrorRelation(describe(s)) === null) continue;
      const c = canonical(row.smiles);
      const cm = c === null ? null : canonical(swap(c));
      if (c === null || cm === null) continue;
      compared++;
      const ours = relate(s, mirror(s)).relation === 'identical';
      if (ours !== (c === cm)) disagree.push(`${row.file}:${row.row}`);
    }
    expect(compared).toBeGreaterThan(100);
    expect(disagree).toEqual([]);
  }, 120_000);
});
