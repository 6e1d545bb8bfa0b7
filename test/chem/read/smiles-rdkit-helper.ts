/**
 * One RDKit MinimalLib instance (@rdkit/rdkit, WebAssembly) for the SMILES tests, and its canonical SMILES.
 * RDKit is the external reference here: canonical(x) === canonical(y) means RDKit reads x and y as the same
 * molecule, stereo included.
 */
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import type { MainModule } from '@rdkit/rdkit';
import { sharedDataPath } from '../../support/shared-data.js';

let instance: Promise<MainModule> | null = null;

export function loadRDKit(): Promise<MainModule> {
  // The package is CommonJS (module.exports = initRDKitModule); its .d.ts declares an ES default export.
  instance ??= import('@rdkit/rdkit').then((m) => {
    const mod = m as unknown as {
      default: (() => Promise<MainModule>) | { default: () => Promise<MainModule> };
    };
    const init = typeof mod.default === 'function' ? mod.default : mod.default.default;
    return init();
  });
  return instance;
}

/** RDKit canonical isomeric SMILES, or null when RDKit cannot read the input. */
export function rdkitCanonical(rd: MainModule, smiles: string): string | null {
  const mol = rd.get_mol(smiles);
  if (!mol) return null;
  try {
    return mol.is_valid() ? mol.get_smiles() : null;
  } finally {
    mol.delete();
  }
}

/**
 * Canonical SMILES plus the count of atoms RDKit keeps a tetrahedral chiral tag on (commonchem JSON
 * "stereo": cw/ccw), from one RDKit read; null when RDKit cannot read the input.
 */
export function rdkitCanonicalAndTags(
  rd: MainModule,
  smiles: string,
): { canonical: string; chiralTags: number } | null {
  const mol = rd.get_mol(smiles);
  if (!mol) return null;
  try {
    if (!mol.is_valid()) return null;
    const json = JSON.parse(mol.get_json()) as { molecules: { atoms: { stereo?: string }[] }[] };
    const chiralTags = json.molecules[0]!.atoms.filter((a) => a.stereo === 'cw' || a.stereo === 'ccw').length;
    return { canonical: mol.get_smiles(), chiralTags };
  } finally {
    mol.delete();
  }
}

/** Every `smiles` cell of the four MoleculeNet CSV files (Wu et al., Chem. Sci. 2018, 9, 513). */
export function moleculeNetSmiles(): string[] {
  const out: string[] = [];
  for (const f of ['bbbp.csv', 'clintox.csv', 'sider.csv', 'tox21.csv']) {
    const rows = parse(readFileSync(sharedDataPath('moleculenet', f), 'utf8'), { columns: true }) as Record<
      string,
      string
    >[];
    for (const r of rows) if (r.smiles) out.push(r.smiles);
  }
  return out;
}
