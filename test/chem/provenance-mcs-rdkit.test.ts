/**
 * The common-substructure search against an outside reference: RDKit MinimalLib's FMCS (`get_mcs_as_json`,
 * @rdkit/rdkit) with the same rules — elements equal, bond orders equal with aromatic a class of its own
 * (BondCompare OrderExact), rings free to match chains, connected, largest by bonds. Pairs of neighbouring
 * single-component structures of MoleculeNet's BBBP set (Wu et al., Chem. Sci. 2018, 9, 513), up to 30 heavy
 * atoms each. The two aromaticity models differ on a few heteroaromatic systems (amino-pyrazines, fused
 * imidazoles), which changes which bonds count as aromatic; the bar allows for those and every difference is
 * printed.
 */
import { describe as suite, expect, it } from 'vitest';
import { readStructure } from '../../src/chem/index.js';
import { analyse } from '../../src/chem/describe/index.js';
import { commonSubstructure, mcsGraph } from '../../src/chem/provenance/index.js';
import { loadRDKit } from './read/smiles-rdkit-helper.js';
import { loadMoleculeNet } from '../support/moleculenet.js';
import { haveSharedData } from '../support/shared-data.js';

const have = haveSharedData('moleculenet', 'bbbp.csv');

suite.skipIf(!have)('largest common substructure vs RDKit FMCS (BBBP pairs)', () => {
  it('agrees on the number of shared bonds for at least 90% of 40 pairs, and the mapping is a real common substructure', async () => {
    const rd = await loadRDKit();
    const rows = loadMoleculeNet(['bbbp.csv'])
      .filter((r) => !r.smiles.includes('.'))
      .slice(0, 400);
    const usable = rows
      .map((r) => ({ smiles: r.smiles, read: readStructure(r.smiles, { format: 'smiles' }) }))
      .filter((x) => x.read.ok && rd.get_mol(x.smiles)?.is_valid());
    let pairs = 0;
    let agree = 0;
    const differ: string[] = [];
    for (let i = 0; i + 1 < usable.length && pairs < 40; i += 2) {
      const [a, b] = [usable[i], usable[i + 1]];
      if (!a.read.ok || !b.read.ok) continue;
      const ga = mcsGraph(analyse(a.read.structure).p);
      const gb = mcsGraph(analyse(b.read.structure).p);
      if (ga.n > 30 || gb.n > 30) continue;
      pairs++;
      const ours = commonSubstructure(ga, gb);
      expect(ours.complete).toBe(true);
      // every shared bond counted really is in both, with the same class, and the map is injective
      const images = [...ours.map].filter((v) => v >= 0);
      expect(new Set(images).size).toBe(images.length);
      expect(images.length).toBe(ours.atoms);
      let shared = 0;
      for (let u = 0; u < ga.n; u++)
        ga.nbrs[u].forEach((w, k) => {
          if (u < w && ours.map[u] >= 0 && ours.map[w] >= 0) {
            const l = gb.nbrs[ours.map[u]];
            const q = Array.from(l).indexOf(ours.map[w]);
            if (q >= 0 && gb.cls[ours.map[u]][q] === ga.cls[u][k]) shared++;
          }
        });
      expect(shared).toBe(ours.bonds);
      const list = new rd.MolList();
      const ma = rd.get_mol(a.smiles)!;
      const mb = rd.get_mol(b.smiles)!;
      list.append(ma);
      list.append(mb);
      const ref = JSON.parse(
        rd.get_mcs_as_json(
          list,
          JSON.stringify({
            AtomCompare: 'Elements',
            BondCompare: 'OrderExact',
            RingMatchesRingOnly: false,
            CompleteRingsOnly: false,
            Timeout: 10,
          }),
        ),
      ) as { numBonds: number; numAtoms: number };
      ma.delete();
      mb.delete();
      list.delete();
      if (ref.numBonds === ours.bonds) agree++;
      else differ.push(`${a.smiles} | ${b.smiles}: ours ${ours.bonds} bonds, RDKit ${ref.numBonds}`);
    }
    if (differ.length) console.info(`[provenance mcs] differences from RDKit:\n${differ.join('\n')}`);
    expect(pairs).toBe(40);
    expect(agree).toBeGreaterThanOrEqual(36);
  }, 60_000);
});
