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
  /**
   * Optional, cheaper still: the heavy-atom formula (Hill order without H and without the charge, see
   * `heavyFormula` and `heavyAtomCandidates`) straight from SMILES text, without a full read (syntax only: no kekulization, no
   * hydrogens, no stereo). Null when it cannot be had that way. Lets the registry index read in full only the
   * records whose heavy atoms match.
   */
  smilesHeavyAtoms?(smiles: string): string | null;
}

/**
 * Hill formula (molecularFormula's form) -> every heavy-atom formula (no hydrogen, no charge) it can stand for.
 * Usually one: 'C6H12O6' -> ['C6O6'], 'HgCl2' -> ['HgCl2'], 'H2O' -> ['O']. The digits before a charge sign are
 * ambiguous ('C6H8O82-' is O8 with charge 2-, or O82 with charge 1-), so then each reading is given.
 */
export function heavyAtomCandidates(formula: string): string[] {
  const bases: string[] = [];
  const sign = formula.endsWith('+') || formula.endsWith('-');
  if (!sign) bases.push(formula);
  else {
    const body = formula.slice(0, -1);
    const digits = /\d*$/.exec(body)![0];
    const prefix = body.slice(0, body.length - digits.length);
    const count = (d: string): boolean => d === '' || (d[0] !== '0' && Number(d) >= 2);
    for (let i = 0; i <= digits.length; i++) {
      const own = digits.slice(0, i);
      if (count(own) && count(digits.slice(i))) bases.push(prefix + own);
    }
  }
  return [...new Set(bases.map((b) => b.replace(/H(?![a-z])\d*/g, '')))];
}

/** Hill order without hydrogen: carbon first when present, then alphabetical; '*' wildcards last. */
export function heavyFormula(elements: Iterable<string>, wildcards: number): string {
  const counts = new Map<string, number>();
  for (const e of elements) counts.set(e, (counts.get(e) ?? 0) + 1);
  const order = [...counts.keys()].sort((x, y) => {
    if (x === 'C' || y === 'C') return x === 'C' ? (y === 'C' ? 0 : -1) : 1;
    return x < y ? -1 : x > y ? 1 : 0;
  });
  let out = '';
  for (const e of order) {
    const c = counts.get(e)!;
    out += c === 1 ? e : `${e}${c}`;
  }
  if (wildcards > 0) out += wildcards === 1 ? '*' : `*${wildcards}`;
  return out;
}

/** Engine settings that come from the audit configuration. */
export interface EngineSettings {
  /** Minimum ortho substituents for a potential biaryl axis (AuditConfig.axisOrthoMin). */
  axisOrthoMin?: number;
}

/** The real engine (src/chem), loaded on first use. */
export async function defaultEngine(settings: EngineSettings = {}): Promise<AuditEngine> {
  const chem = await import('../chem/index.js');
  const graph = await import('../chem/graph/index.js');
  const syntax = await import('../chem/read/smiles-parse.js');
  return {
    readStructure: (text, options) => chem.readStructure(text, options),
    describe:
      settings.axisOrthoMin === undefined
        ? (s) => chem.describe(s)
        : (s) => chem.describe(s, { axisOrthoMin: settings.axisOrthoMin }),
    relate: (a, b) => chem.relate(a, b),
    formula: (s) => graph.molecularFormula(s),
    smilesHeavyAtoms: (smiles) => {
      let start = 0;
      // the same leading blanks the SMILES reader skips
      while (start < smiles.length && ' \t\n\r'.includes(smiles[start]!)) start++;
      let g;
      try {
        g = syntax.parseSmilesGraph(smiles, start);
      } catch {
        return null;
      }
      if ('error' in g) return null;
      const heavy: string[] = [];
      let wildcards = 0;
      // as molecularFormula counts them: atomic number 0 or '*' is a wildcard, 1 is hydrogen
      for (const a of g.atoms) {
        if (a.atomicNumber === 0 || a.element === '*') wildcards++;
        else if (a.atomicNumber !== 1) heavy.push(a.element);
      }
      return heavyFormula(heavy, wildcards);
    },
  };
}
