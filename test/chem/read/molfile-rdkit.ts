/** Typed access to the RDKit MinimalLib calls the molfile tests use (npm @rdkit/rdkit). */
export interface RdMol {
  get_smiles(): string;
  remove_hs_in_place(): void;
  get_substruct_matches(q: RdMol, details?: string): string;
  get_molblock(): string;
  get_json(): string;
  delete(): void;
}
export interface Rd {
  get_mol(input: string, details?: string): RdMol | null;
}

let loading: Promise<Rd> | null = null;
export function rdkit(): Promise<Rd> {
  loading ??= import('@rdkit/rdkit').then((m) => (m as unknown as { default: () => Promise<Rd> }).default());
  return loading;
}
