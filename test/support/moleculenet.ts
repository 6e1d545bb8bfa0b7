/**
 * Reads the SMILES column of the MoleculeNet CSV files in ../shared/data/moleculenet
 * (Wu et al., "MoleculeNet: a benchmark for molecular machine learning", Chem. Sci. 2018, 9, 513–530).
 */
import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { sharedDataPath } from './shared-data.js';

export const MOLECULENET_FILES = ['clintox.csv', 'bbbp.csv', 'tox21.csv', 'sider.csv'] as const;

export interface MoleculeNetRow {
  file: string;
  /** 1-based data row number (the header is row 0), i.e. line number minus one for unquoted files. */
  row: number;
  smiles: string;
}

export function loadMoleculeNet(files: readonly string[] = MOLECULENET_FILES): MoleculeNetRow[] {
  const out: MoleculeNetRow[] = [];
  for (const file of files) {
    const text = readFileSync(sharedDataPath('moleculenet', file), 'utf8');
    const rows = parse(text, { columns: true, skip_empty_lines: true, relax_column_count: true }) as Record<
      string,
      string
    >[];
    rows.forEach((r, i) => {
      const smiles = (r.smiles ?? '').trim();
      if (smiles) out.push({ file, row: i + 1, smiles });
    });
  }
  return out;
}
