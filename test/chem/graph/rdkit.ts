/**
 * Reference structures from RDKit (@rdkit/rdkit MinimalLib): a SMILES is read by RDKit, and its Kekulé form
 * (commonchem JSON, `get_json`) is turned into our Structure with every aromatic flag cleared, so that ring and
 * aromaticity perception here must find on their own what RDKit found.
 */
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { ELEMENTS } from '../../../src/chem/read/valence.js';
import type { BondOrder, Structure } from '../../../src/chem/types.js';

export interface RdkitMol {
  get_json(): string;
  get_smiles(details?: string): string;
  get_descriptors(): string;
  is_valid?(): boolean;
  delete(): void;
}
export interface RdkitModule {
  get_mol(smiles: string, details?: string): RdkitMol | null;
}

let modulePromise: Promise<RdkitModule> | null = null;
export function loadRdkit(): Promise<RdkitModule> {
  if (!modulePromise) {
    modulePromise = import('@rdkit/rdkit').then(async (m) => {
      const init = (m as unknown as { default: () => Promise<RdkitModule> }).default;
      return init();
    });
  }
  return modulePromise;
}

export interface RdkitReference {
  structure: Structure;
  /** RDKit's ring atom sets (its symmetrized SSSR). */
  rings: number[][];
  numRings: number;
  numAromaticRings: number;
}

interface Json {
  defaults: { atom: Record<string, number>; bond: Record<string, number> };
  molecules: {
    atoms: { z?: number; impHs?: number; chg?: number; nRad?: number; isotope?: number }[];
    bonds?: { bo?: number; atoms: [number, number] }[];
    extensions?: { name: string; atomRings?: number[][] }[];
  }[];
}

export function fromRdkit(rd: RdkitModule, smiles: string): RdkitReference | null {
  const mol = rd.get_mol(smiles);
  if (!mol) return null;
  try {
    if (mol.is_valid && !mol.is_valid()) return null;
    const json = JSON.parse(mol.get_json()) as Json;
    const desc = JSON.parse(mol.get_descriptors()) as { NumRings: number; NumAromaticRings: number };
    const m = json.molecules[0];
    const da = json.defaults.atom;
    const structure: Structure = {
      atoms: m.atoms.map((a, i) => {
        const z = a.z ?? da.z;
        return {
          element: ELEMENTS[z] ?? '*',
          atomicNumber: z,
          charge: a.chg ?? da.chg,
          isotope: (a.isotope ?? da.isotope) || null,
          hCount: a.impHs ?? da.impHs,
          aromatic: false,
          radical: a.nRad ?? da.nRad,
          mapNumber: null,
          inputNumber: i + 1,
          coords: null,
        };
      }),
      bonds: (m.bonds ?? []).map((b) => ({
        a: b.atoms[0],
        b: b.atoms[1],
        order: ((b.bo ?? 1) || 1) as BondOrder,
        aromatic: false,
        wedge: null,
      })),
      stereo: [],
      groups: [],
      chiralFlag: null,
      title: null,
      properties: {},
      dimension: 0,
    };
    const ext = m.extensions?.find((e) => e.name === 'rdkitRepresentation');
    return {
      structure,
      rings: ext?.atomRings ?? [],
      numRings: desc.NumRings,
      numAromaticRings: desc.NumAromaticRings,
    };
  } finally {
    mol.delete();
  }
}

/** RDKit's SMILES for the molecule, with writer options (doKekule, doRandom, rootedAtAtom, canonical). */
export function rdkitSmiles(
  rd: RdkitModule,
  smiles: string,
  details?: Record<string, unknown>,
): string | null {
  const mol = rd.get_mol(smiles);
  if (!mol) return null;
  try {
    if (mol.is_valid && !mol.is_valid()) return null;
    return details ? mol.get_smiles(JSON.stringify(details)) : mol.get_smiles();
  } finally {
    mol.delete();
  }
}

/** SMILES column of a MoleculeNet CSV (Wu et al., Chem. Sci. 9 (2018) 513). */
export function moleculeNetSmiles(path: string): string[] {
  const rows = parse(readFileSync(path, 'utf8'), { columns: true, skip_empty_lines: true }) as Record<
    string,
    string
  >[];
  return rows.map((r) => r.smiles).filter((x): x is string => typeof x === 'string' && x.length > 0);
}
