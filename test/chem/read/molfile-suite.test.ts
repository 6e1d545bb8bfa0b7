/**
 * The molfile/SD reader on the CIP validation suite of Hanson et al., "Algorithmic Analysis of
 * Cahn-Ingold-Prelog Rules of Stereochemistry", J. Chem. Inf. Model. 2018, 58, 1755-1765 (files
 * compounds_2d.sdf and compounds_3d.sdf, 300 records each; field formats in ../shared/data/.../SOURCE.md),
 * cross-checked with RDKit (npm @rdkit/rdkit, MinimalLib).
 */
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { readSdRecords } from '../../../src/chem/read/sdf.js';
import { writeSmiles } from '../../../src/chem/write/smiles.js';
import { IMPLICIT_H, LONE_PAIR, type StereoElement, type Structure } from '../../../src/chem/types.js';
import { rdkit, type Rd } from './molfile-rdkit.js';
import { haveSharedData, sharedDataPath } from '../../support/shared-data.js';

const have = haveSharedData('cip-validation-suite');

interface Rec {
  block: string;
  s: Structure;
}

function load(file: string): Rec[] {
  const text = readFileSync(sharedDataPath('cip-validation-suite', file), 'utf8');
  const blocks = text.split('$$$$\n').filter((b) => b.trim() !== '');
  const out: Rec[] = [];
  let i = 0;
  for (const r of readSdRecords(text)) {
    if (!r.result.ok) throw new Error(`${file} record ${r.record}: ${r.result.error.message}`);
    out.push({ block: blocks[i++]!.split('M  END')[0] + 'M  END\n', s: r.result.structure });
  }
  return out;
}

/** Labels "3R 7S" -> [[atom index, descriptor]]. */
function labels(s: Structure): [number, string][] {
  const f = (s.properties['CIP_LABELS'] ?? '').trim();
  return f === '' ? [] : f.split(/\s+/).map((l) => [Number(l.slice(0, -1)) - 1, l.slice(-1)]);
}

function kindFor(d: string): StereoElement['kind'] {
  return 'RSrs'.includes(d) ? 'tetrahedral' : 'EZez'.includes(d) ? 'double-bond' : 'axial';
}

function elementAt(s: Structure, atom: number, kind: StereoElement['kind']): StereoElement | undefined {
  return s.stereo.find(
    (e) => e.kind === kind && (e.kind === 'tetrahedral' ? e.centre === atom : e.ends.includes(atom)),
  );
}

/** Helicenes (unit HE) label two atoms that are not bonded; Structure has no element for them (see report). */
const isHelicene = (s: Structure): boolean => (s.properties['STEREOGENIC_UNITS'] ?? '').includes('HE');

function formula(s: Structure): string {
  const c = new Map<string, number>();
  for (const a of s.atoms) {
    c.set(a.element, (c.get(a.element) ?? 0) + 1);
    if (a.hCount > 0) c.set('H', (c.get('H') ?? 0) + a.hCount);
  }
  return [...c.entries()]
    .sort()
    .map(([e, n]) => `${e}${n}`)
    .join('');
}

/** Parity (0 even, 1 odd) of the permutation taking list a to list b (same members). */
function parity(a: number[], b: number[]): number | null {
  const pos = b.map((x) => a.indexOf(x));
  if (pos.some((p) => p < 0) || new Set(pos).size !== pos.length) return null;
  let p = 0;
  const seen = new Array<boolean>(pos.length).fill(false);
  for (let i = 0; i < pos.length; i++) {
    if (seen[i]) continue;
    let len = 0;
    for (let j = i; !seen[j]; j = pos[j]!) {
      seen[j] = true;
      len++;
    }
    p ^= (len - 1) & 1;
  }
  return p;
}

/** Same configuration of a 2D element e2 and a 3D element e3 under the atom map m (2D index -> 3D index). */
function sameConfiguration(e2: StereoElement, e3: StereoElement, m: number[], s3: Structure): boolean {
  const hOf = (centre2: number, centre3: number, known: number[]): number => {
    // the implicit H of a 2D centre is the 3D hydrogen neighbour the map leaves over
    const nb = s3.bonds.flatMap((b) => (b.a === centre3 ? [b.b] : b.b === centre3 ? [b.a] : []));
    const free = nb.filter((n) => s3.atoms[n]!.element === 'H' && !known.includes(n));
    void centre2;
    return free.length === 1 ? free[0]! : -99;
  };
  const mapLigands = (ligs: number[], centres2: number[], centres3: number[]): number[] => {
    const known = ligs.filter((l) => l >= 0).map((l) => m[l]!);
    return ligs.map((l, i) => {
      if (l >= 0) return m[l]!;
      if (l === LONE_PAIR) return LONE_PAIR;
      const side = centres2.length === 1 ? 0 : i < 2 ? 0 : 1;
      return hOf(centres2[side]!, centres3[side]!, known);
    });
  };
  if (e2.kind === 'tetrahedral' && e3.kind === 'tetrahedral') {
    const l2 = mapLigands(e2.ligands, [e2.centre], [e3.centre]);
    const l3 = e3.ligands.map((l) =>
      l === IMPLICIT_H
        ? hOf(
            -1,
            e3.centre,
            e3.ligands.filter((x) => x >= 0),
          )
        : l,
    );
    const p = parity(l2, l3);
    return p !== null && (p === 0) === (e2.winding === e3.winding);
  }
  if (e2.kind === 'axial' && e3.kind === 'axial') {
    const ends3 = m[e2.ends[0]] === e3.ends[0] ? e3.ends : [e3.ends[1], e3.ends[0]];
    const l2 = mapLigands(e2.ligands, [...e2.ends], [...ends3]);
    const l3 = e3.ligands.map((l, i) =>
      l === IMPLICIT_H
        ? hOf(
            -1,
            e3.ends[i < 2 ? 0 : 1],
            e3.ligands.filter((x) => x >= 0),
          )
        : l,
    );
    const p = parity(l2, l3);
    return p !== null && (p === 0) === (e2.winding === e3.winding);
  }
  if (e2.kind === 'double-bond' && e3.kind === 'double-bond') {
    let flips = 0;
    const ends3 = m[e2.ends[0]] === e3.ends[0] ? [0, 1] : [1, 0];
    for (let k = 0; k < 2; k++) if (m[e2.refs[k]!] !== e3.refs[ends3[k]!]) flips++;
    return (flips % 2 === 0) === (e2.relation === e3.relation);
  }
  return false;
}

describe.skipIf(!have)(
  'CIP validation suite (Hanson et al., J. Chem. Inf. Model. 2018, 58, 1755-1765)',
  () => {
    let d2: Rec[] = [];
    let d3: Rec[] = [];
    let RDKit: Rd;
    beforeAll(async () => {
      d2 = load('compounds_2d.sdf');
      d3 = load('compounds_3d.sdf');
      RDKit = await rdkit();
    });

    it('reads all 300 records of each file, with STRUCTURE_ID in the same order', () => {
      expect(d2.length).toBe(300);
      expect(d3.length).toBe(300);
      for (let i = 0; i < 300; i++)
        expect(d3[i]!.s.properties['STRUCTURE_ID']).toBe(d2[i]!.s.properties['STRUCTURE_ID']);
    });

    it('gives the same molecular formula from the 2D file (implicit H) and the 3D file (explicit H atoms)', () => {
      // The 3D file lists hydrogens as atoms and orders atoms differently, so element sequences cannot agree;
      // the formula checks the implicit-hydrogen counts of the 2D reading against the 3D hydrogens.
      for (let i = 0; i < 300; i++) expect(formula(d3[i]!.s), d2[i]!.s.title ?? '').toBe(formula(d2[i]!.s));
    });

    it('puts a stereo element of the right kind on every atom named in CIP_LABELS, in both files', () => {
      const missing: string[] = [];
      for (const recs of [d2, d3]) {
        for (const { s } of recs) {
          if (isHelicene(s)) continue;
          for (const [atom, d] of labels(s)) {
            if (!elementAt(s, atom, kindFor(d))) missing.push(`${s.title} ${atom + 1}${d} (${s.dimension}D)`);
          }
        }
      }
      expect(missing).toEqual([]);
    });

    it('reads the same configuration from the wedges (2D) and the coordinates (3D) for every labelled unit', () => {
      // Atom map 2D -> 3D from RDKit substructure matching (all matches, so symmetric molecules may pick any).
      const disagree: string[] = [];
      for (let i = 0; i < 300; i++) {
        const { s: s2, block: b2 } = d2[i]!;
        const { s: s3, block: b3 } = d3[i]!;
        const units = labels(s2)
          .map(([a, d]) => elementAt(s2, a, kindFor(d)))
          .filter((e): e is StereoElement => !!e);
        if (units.length === 0) continue;
        const q = RDKit.get_mol(b2, JSON.stringify({ removeHs: false }))!;
        const t = RDKit.get_mol(b3, JSON.stringify({ removeHs: false }))!;
        const matches: { atoms: number[] }[] = JSON.parse(
          t.get_substruct_matches(q, JSON.stringify({ uniquify: false, maxMatches: 2000 })),
        );
        q.delete();
        t.delete();
        const ok = matches.some(({ atoms: m }) =>
          units.every((e2) => {
            const key = e2.kind === 'tetrahedral' ? m[e2.centre]! : m[e2.ends[0]]!;
            const e3 = elementAt(s3, key, e2.kind);
            return e3 !== undefined && sameConfiguration(e2, e3, m, s3);
          }),
        );
        if (!ok) disagree.push(`${s2.title} (${matches.length} matches)`);
      }
      expect(disagree).toEqual([]);
    });

    it('RDKit canonical SMILES of the 2D and 3D molblocks agree (sanity check of the data)', () => {
      const differ: string[] = [];
      for (let i = 0; i < 300; i++) {
        const a = RDKit.get_mol(d2[i]!.block)!;
        const b = RDKit.get_mol(d3[i]!.block)!;
        a.remove_hs_in_place();
        b.remove_hs_in_place();
        if (a.get_smiles() !== b.get_smiles()) differ.push(d2[i]!.s.title ?? '');
        a.delete();
        b.delete();
      }
      // RDKit itself does not read every 3D unit the same way as the 2D drawing (e.g. some P/S centres);
      // the point here is that the files describe the same compounds for nearly all records.
      expect(differ.length).toBeLessThan(10);
    });

    it('RDKit-canonical(writeSmiles(read 2D record)) equals RDKit-canonical(2D molblock) for all 300 records', () => {
      const differ: string[] = [];
      for (const { s, block } of d2) {
        const ref = RDKit.get_mol(block)!;
        ref.remove_hs_in_place();
        const ours = RDKit.get_mol(writeSmiles(s));
        const got = ours ? (ours.remove_hs_in_place(), ours.get_smiles()) : 'unreadable';
        if (got !== ref.get_smiles()) differ.push(`${s.title}: ${got} vs ${ref.get_smiles()}`);
        ref.delete();
        ours?.delete();
      }
      expect(differ).toEqual([]);
    });
  },
);
