/**
 * The graph functions on real structures: MoleculeNet SMILES (Wu et al., Chem. Sci. 9 (2018) 513) read by our
 * SMILES reader, checked against RDKit (@rdkit/rdkit MinimalLib): RDKit's canonical SMILES are equal exactly
 * when two structures have the same constitution, and RDKit rewrites a SMILES in other atom orders and as
 * Kekulé or aromatic SMILES for the invariance checks.
 */
import { describe, expect, it } from 'vitest';
import {
  aromaticBonds,
  automorphisms,
  connectedComponents,
  constitutionKey,
  equivalenceClasses,
  isomorphic,
  molecularFormula,
  ringInfo,
} from '../../../src/chem/graph/index.js';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import type { Structure } from '../../../src/chem/types.js';
import { haveSharedData, sharedDataPath } from '../../support/shared-data.js';
import { loadRdkit, moleculeNetSmiles, rdkitSmiles } from './rdkit.js';

const FILES = ['bbbp.csv', 'clintox.csv', 'sider.csv', 'tox21.csv'];
const noStereo = (smi: string) => smi.replace(/[@/\\]/g, '');

function read(smi: string): Structure | null {
  const r = parseSmiles(smi);
  return r.ok ? r.structure : null;
}

function allSmiles(): string[] {
  return FILES.flatMap((f) => moleculeNetSmiles(sharedDataPath('moleculenet', f)));
}

function groupOrder(s: Structure): number {
  let count = 0;
  automorphisms(s, { maxResults: 5000, onMapping: () => (count++, true) });
  return count;
}

describe.skipIf(!haveSharedData('moleculenet'))('MoleculeNet against RDKit', () => {
  it('isomorphic() and constitutionKey agree with RDKit canonical SMILES on same-formula pairs', async () => {
    const rd = await loadRdkit();
    const byFormula = new Map<string, string[]>();
    for (const smi of allSmiles()) {
      const s = read(noStereo(smi));
      if (!s) continue;
      const f = molecularFormula(s);
      byFormula.set(f, [...(byFormula.get(f) ?? []), noStereo(smi)]);
    }
    const groups = [...byFormula.values()]
      .filter((g) => g.length > 1)
      .sort((a, b) => a[0].length - b[0].length);
    let pairs = 0;
    let samePairs = 0;
    const wrong: string[] = [];
    let used = 0;
    for (const group of groups) {
      if (used > 900) break;
      used += group.length;
      const items = group
        .map((smi) => ({ smi, s: read(smi)!, canon: rdkitSmiles(rd, smi) }))
        .filter((x) => x.canon !== null);
      for (let i = 0; i < items.length; i++) {
        for (let j = i + 1; j < items.length; j++) {
          const x = items[i];
          const y = items[j];
          const same = x.canon === y.canon;
          pairs++;
          if (same) samePairs++;
          if ((isomorphic(x.s, y.s) !== null) !== same) wrong.push(`isomorphic ${x.smi} | ${y.smi}`);
          if ((constitutionKey(x.s) === constitutionKey(y.s)) !== same) wrong.push(`key ${x.smi} | ${y.smi}`);
        }
      }
    }
    expect(pairs).toBeGreaterThan(500);
    expect(samePairs).toBeGreaterThan(50);
    expect(wrong).toEqual([]);
  }, 300_000);

  it('RDKit rewrites (random atom order, Kekulé or aromatic) give the same key, classes and symmetry', async () => {
    const rd = await loadRdkit();
    const smiles = allSmiles();
    let compared = 0;
    const wrong: string[] = [];
    for (let i = 0; i < smiles.length; i += 60) {
      const base = noStereo(smiles[i]);
      const a = read(base);
      const kek = rdkitSmiles(rd, base, { canonical: false, doRandom: true, doKekule: true });
      const aro = rdkitSmiles(rd, base, { canonical: false, doRandom: true });
      if (!a || !kek || !aro) continue;
      for (const other of [kek, aro]) {
        const b = read(other);
        if (!b) continue;
        compared++;
        const sorted = (x: Int32Array) =>
          Array.from(x)
            .sort((p, q) => p - q)
            .join(',');
        if (constitutionKey(a) !== constitutionKey(b)) wrong.push(`key ${base} | ${other}`);
        if (sorted(equivalenceClasses(a)) !== sorted(equivalenceClasses(b)))
          wrong.push(`classes ${base} | ${other}`);
        if (!isomorphic(a, b)) wrong.push(`isomorphic ${base} | ${other}`);
        if (groupOrder(a) !== groupOrder(b)) wrong.push(`group order ${base} | ${other}`);
      }
    }
    expect(compared).toBeGreaterThan(350);
    expect(wrong).toEqual([]);
  }, 300_000);
});

describe.skipIf(!haveSharedData('moleculenet'))('every MoleculeNet structure', () => {
  it('goes through rings, aromaticity, key, classes and keyed automorphisms without error or budget cut', () => {
    const problems: string[] = [];
    let n = 0;
    for (const smi of allSmiles()) {
      const s = read(smi);
      if (!s) continue;
      n++;
      try {
        const info = ringInfo(s);
        aromaticBonds(s, info);
        const cyclomatic = s.bonds.length - s.atoms.length + connectedComponents(s).length;
        if (info.rings.length !== cyclomatic) problems.push(`ring count ${smi}`);
        constitutionKey(s);
        const classes = equivalenceClasses(s);
        const key = s.stereo.flatMap((u) => (u.kind === 'tetrahedral' ? [u.centre] : [...u.ends]));
        const r = automorphisms(s, { key, colour: classes, onMapping: () => true });
        if (!r.complete) problems.push(`incomplete ${smi}`);
      } catch (e) {
        problems.push(`${(e as Error).message} ${smi}`);
      }
    }
    expect(n).toBeGreaterThan(12000);
    expect(problems).toEqual([]);
  }, 300_000);
});
