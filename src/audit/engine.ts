/** The engine functions the audit needs, as one injectable object (tests pass a fake one). */
import type { RelationFacts, StructureFacts } from '../chem/facts.js';
import type { ReadResult, Structure } from '../chem/types.js';

export interface AuditEngine {
  readStructure(text: string, options: { format: 'smiles' | 'molfile' }): ReadResult;
  describe(structure: Structure): StructureFacts;
  relate(a: Structure, b: Structure): RelationFacts;
  /**
   * Optional cheap molecular formula of a structure as read, equal to the part of `describe(s).constitutionKey`
   * before its '/'. Lets the registry index describe only records with the right formula.
   */
  formula?(structure: Structure): string;
}

/** The real engine (src/chem), loaded on first use. */
export async function defaultEngine(): Promise<AuditEngine> {
  const chem = await import('../chem/index.js');
  const graph = await import('../chem/graph/index.js');
  return {
    readStructure: (text, options) => chem.readStructure(text, options),
    describe: (s) => chem.describe(s),
    relate: (a, b) => chem.relate(a, b),
    formula: (s) => graph.molecularFormula(s),
  };
}
