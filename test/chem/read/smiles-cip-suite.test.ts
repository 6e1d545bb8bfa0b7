/**
 * The CIP validation suite SMILES (R. M. Hanson et al., "Algorithmic Analysis of Cahn-Ingold-Prelog Rules of
 * Stereochemistry", J. Chem. Inf. Model. 2018, 58, 1755-1765; ../shared/data/cip-validation-suite) must all
 * read, and every labelled atom number must name an atom of the kind the label needs, under the suite's
 * numbering (1-based input order, explicit H atoms counted, bracket H not).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { writeSmilesWithOrder } from '../../../src/chem/write/smiles.js';
import { stereoDifferences } from '../write/stereo-same.js';
import { loadRDKit, rdkitCanonical } from './smiles-rdkit-helper.js';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import type { Structure } from '../../../src/chem/types.js';
import { haveSharedData, sharedDataPath } from '../../support/shared-data.js';

interface Entry {
  smiles: string;
  id: string;
  labels: { atom: number; descriptor: string }[];
  units: string;
}

function entries(): Entry[] {
  const text = readFileSync(sharedDataPath('cip-validation-suite', 'compounds.smi'), 'utf8');
  return text
    .split('\n')
    .filter((l) => l.trim() !== '')
    .map((l) => {
      const [smiles = '', id = '', labels = '', , units = ''] = l.split('\t');
      return {
        smiles,
        id,
        units,
        labels: labels
          .split(' ')
          .filter(Boolean)
          .map((t) => ({ atom: parseInt(t, 10), descriptor: t.replace(/^\d+/, '') })),
      };
    });
}

/** What our reader must show at a labelled atom (index = number - 1). */
function carries(s: Structure, idx: number, descriptor: string): boolean {
  if ('RSrs'.includes(descriptor)) return s.stereo.some((e) => e.kind === 'tetrahedral' && e.centre === idx);
  if ('EZez'.includes(descriptor))
    return s.stereo.some((e) => e.kind === 'double-bond' && e.ends.includes(idx));
  return s.stereo.some((e) => e.kind === 'axial' && e.ends.includes(idx));
}

describe.skipIf(!haveSharedData('cip-validation-suite'))(
  'CIP validation suite SMILES (Hanson et al. 2018)',
  () => {
    it('reads all 300 entries', () => {
      const all = entries();
      expect(all).toHaveLength(300);
      const failed = all.filter((e) => !parseSmiles(e.smiles).ok).map((e) => e.id);
      expect(failed).toEqual([]);
    });

    it('finds a stereo unit of the right kind at every labelled atom (helicenes and atropisomers excepted)', () => {
      // HE/AT units cannot be written in SMILES (suite README): only their atoms must exist and be carbon.
      const missing: string[] = [];
      let checked = 0;
      for (const e of entries()) {
        const r = parseSmiles(e.smiles);
        if (!r.ok) continue;
        const s = r.structure;
        const axisOnly = /\b(AT|HE)\b/.test(e.units);
        for (const { atom, descriptor } of e.labels) {
          const a = s.atoms[atom - 1];
          if (!a) {
            missing.push(`${e.id} ${atom}${descriptor}: no such atom`);
            continue;
          }
          if (axisOnly && 'MP'.includes(descriptor)) {
            if (a.element !== 'C') missing.push(`${e.id} ${atom}${descriptor}: ${a.element}`);
            continue;
          }
          checked++;
          if (!carries(s, atom - 1, descriptor)) missing.push(`${e.id} ${atom}${descriptor} on ${a.element}`);
        }
      }
      expect(checked).toBeGreaterThan(400);
      expect(missing).toEqual([]);
    });

    it('skips bracket H in the numbering, as the suite does (VS016: labels 3R 5R fall on [C@H] carbons)', () => {
      const e = entries().find((x) => x.id === 'VS016')!;
      const r = parseSmiles(e.smiles);
      expect(e.labels.map((l) => l.atom)).toEqual([3, 5]);
      expect(r.ok).toBe(true);
      if (!r.ok) return;
      for (const { atom } of e.labels) {
        expect(r.structure.atoms[atom - 1]).toMatchObject({ element: 'C', hCount: 1 });
        expect(r.structure.stereo.some((x) => x.kind === 'tetrahedral' && x.centre === atom - 1)).toBe(true);
      }
    });

    it('writes every entry back in three atom orders without changing it (RDKit canonical SMILES; our reader)', async () => {
      // RDKit (@rdkit/rdkit) judges tetrahedral and cis/trans stereo; it drops allene marks, which our own
      // reader checks through stereoDifferences.
      const rd = await loadRDKit();
      let seed = 12345;
      const random = (): number => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
      const problems: string[] = [];
      let written = 0;
      for (const e of entries()) {
        const r = parseSmiles(e.smiles);
        if (!r.ok) continue;
        const s = r.structure;
        const n = s.atoms.length;
        const ref = rdkitCanonical(rd, e.smiles);
        const keys = s.atoms.map(() => random());
        const orders = [
          undefined,
          s.atoms.map((_, i) => n - 1 - i),
          s.atoms.map((_, i) => i).sort((x, y) => keys[x]! - keys[y]!),
        ];
        for (const order of orders) {
          const w = writeSmilesWithOrder(s, { order });
          written++;
          if (rdkitCanonical(rd, w.smiles) !== ref) problems.push(`${e.id} RDKit: ${w.smiles}`);
          const back = parseSmiles(w.smiles);
          const diffs = back.ok ? stereoDifferences(s, back.structure, w.atomOrder) : ['unreadable'];
          if (diffs.length > 0) problems.push(`${e.id} ours: ${w.smiles} ${diffs.join('; ')}`);
        }
      }
      expect(written).toBe(900);
      expect(problems).toEqual([]);
    }, 60_000);
  },
);
