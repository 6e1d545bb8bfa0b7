/**
 * Chirality cross-check against an independent implementation: RDKit MinimalLib (@rdkit/rdkit). For every
 * MoleculeNet structure with drawn stereo (Wu et al., "MoleculeNet", Chem. Sci. 2018, 9, 513–530) that we find
 * fully defined, RDKit calls it chiral when its canonical SMILES differs from the canonical SMILES of the mirror
 * image (the @/@@ marks of its canonical SMILES swapped). Every disagreement must be listed, with the reason, in
 * rdkit-disagreements.json; a listed entry that no longer disagrees fails too, so the list stays reviewed.
 */
import { readFileSync } from 'node:fs';
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { parseSmiles } from '../../src/chem/read/smiles.js';
import { haveSharedData } from '../support/shared-data.js';
import { loadMoleculeNet } from '../support/moleculenet.js';
import { loadRdkit } from './graph/rdkit.js';

interface Listed {
  file: string;
  row: number;
  smiles: string;
  ours: boolean;
  rdkit: boolean;
  reason: string;
}

const reviewed = JSON.parse(readFileSync(new URL('./rdkit-disagreements.json', import.meta.url), 'utf8')) as {
  entries: Listed[];
  labels: { file: string; row: number; reason: string }[];
};
const listed = reviewed.entries;
const labelled = reviewed.labels;

interface RdMol {
  get_smiles(): string;
  get_stereo_tags(): string;
  delete(): void;
}

suite.skipIf(!haveSharedData('moleculenet'))(
  'chirality agrees with RDKit MinimalLib over MoleculeNet',
  () => {
    it('every disagreement is listed and every listed one still disagrees', async () => {
      const rd = (await loadRdkit()) as unknown as { get_mol(s: string): RdMol | null };
      const canonical = (smi: string): string | null => {
        const m = rd.get_mol(smi);
        if (!m) return null;
        const out = m.get_smiles();
        m.delete();
        return out;
      };
      const swap = (s: string): string => s.replace(/@@|@/g, (x) => (x === '@@' ? '@' : '@@'));
      const found: { file: string; row: number; smiles: string; ours: boolean; rdkit: boolean }[] = [];
      let compared = 0;
      for (const row of loadMoleculeNet()) {
        if (!/[@/\\]/.test(row.smiles)) continue;
        const r = parseSmiles(row.smiles);
        if (!r.ok) continue;
        const f = describe(r.structure);
        if (f.undefined > 0 || f.chiral === null) continue;
        const can = canonical(row.smiles);
        const canMirror = can === null ? null : canonical(swap(can));
        if (can === null || canMirror === null) continue;
        compared++;
        const rdkit = can !== canMirror;
        if (rdkit !== f.chiral)
          found.push({ file: row.file, row: row.row, smiles: row.smiles, ours: f.chiral, rdkit });
      }
      expect(compared).toBeGreaterThan(2000);
      const key = (d: { file: string; row: number }): string => `${d.file}:${d.row}`;
      const listedKeys = new Set(listed.map(key));
      expect(found.filter((d) => !listedKeys.has(key(d)))).toEqual([]);
      const foundKeys = new Set(found.map(key));
      expect(listed.filter((d) => !foundKeys.has(key(d)))).toEqual([]);
      for (const d of listed) expect(d.reason.length).toBeGreaterThan(20);
    });

    it('labelled stereocentres and double bonds agree with RDKit CIP labels (get_stereo_tags)', async () => {
      // RDKit's labels come from its own CIP implementation; '?' marks an undefined unit there.
      const rd = (await loadRdkit()) as unknown as { get_mol(s: string): RdMol | null };
      const differences: string[] = [];
      let compared = 0;
      for (const row of loadMoleculeNet()) {
        // explicit [H] atoms would shift RDKit's atom indices (it removes them): leave those out
        if (!/[@/\\]/.test(row.smiles) || /\[[23]?H/.test(row.smiles)) continue;
        const r = parseSmiles(row.smiles);
        if (!r.ok) continue;
        const m = rd.get_mol(row.smiles);
        if (!m) continue;
        const tags = JSON.parse(m.get_stereo_tags()) as {
          CIP_atoms?: [number, string][];
          CIP_bonds?: [number, number, string][];
        };
        m.delete();
        const theirs = [
          ...(tags.CIP_atoms ?? []).map(([a, l]) => `${a + 1}${l.replace(/[()]/g, '')}`),
          ...(tags.CIP_bonds ?? []).map(
            ([a, b, l]) => `${Math.min(a, b) + 1}-${Math.max(a, b) + 1}${l.replace(/[()]/g, '')}`,
          ),
        ].filter((x) => !x.endsWith('?'));
        const ours = describe(r.structure)
          .units.filter((u) => u.label !== null && (u.kind === 'tetrahedral' || u.kind === 'double-bond'))
          .map((u) => `${[...u.atoms].sort((x, y) => x - y).join('-')}${u.label}`);
        compared++;
        const a = [...ours].sort().join(' ');
        const b = [...theirs].sort().join(' ');
        if (a !== b) differences.push(`${row.file}:${row.row} ours ${a} rdkit ${b}`);
      }
      expect(compared).toBeGreaterThan(3000);
      const allowed = new Set(labelled.map((d) => `${d.file}:${d.row}`));
      expect(differences.filter((d) => !allowed.has(d.split(' ')[0]))).toEqual([]);
    });
  },
);
