/**
 * The registry index (src/audit/view.ts) with the real engine: filing registry records by the heavy atoms of
 * their SMILES (syntax only) must find exactly what filing them by full formula finds, while reading fewer
 * structures. Chemistry: acrylic acid C3H4O2 and propanoic acid C3H6O2 share their heavy atoms but not their
 * formula; (R)- and (S)-lactic acid are enantiomers with one constitution (IUPAC Gold Book, "enantiomer");
 * succinate, C4H4O4 2-, carries a charge whose digit runs into the oxygen count in the Hill formula (from memory).
 */
import { describe, expect, it } from 'vitest';
import { defaultEngine, heavyAtomCandidates, type AuditEngine } from '../../src/audit/engine.js';
import { StructureCache } from '../../src/audit/structures.js';
import { buildRegistryView } from '../../src/audit/view.js';
import type { LoadedRecord } from '../../src/registry/types.js';
import { NO_POSITIONS } from '../../src/registry/positions.js';
import { loadMoleculeNet } from '../support/moleculenet.js';
import { haveSharedData } from '../support/shared-data.js';

describe('heavyAtomCandidates', () => {
  it('drops hydrogen and charge from a Hill formula', () => {
    expect(heavyAtomCandidates('C6H12O6')).toEqual(['C6O6']);
    expect(heavyAtomCandidates('H2O')).toEqual(['O']);
    expect(heavyAtomCandidates('HgCl2')).toEqual(['HgCl2']); // Hg is not hydrogen
    expect(heavyAtomCandidates('C2H7N+')).toEqual(['C2N']);
    expect(heavyAtomCandidates('C2H4*2')).toEqual(['C2*2']);
  });

  it('gives every reading of the digits before a charge', () => {
    // O4 with charge 2-, O42 with charge 1-, or O with charge 42-
    expect(heavyAtomCandidates('C4H4O42-').sort()).toEqual(['C4O', 'C4O4', 'C4O42']);
    expect(heavyAtomCandidates('ClH2+')).toContain('Cl'); // HCl with charge 2+, or ClH2 with charge 1+
  });
});

const SMILES = {
  acrylic: 'C=CC(=O)O',
  propanoic: 'CCC(=O)O',
  rLactic: 'C[C@@H](O)C(=O)O',
  sLactic: 'C[C@H](O)C(=O)O',
  lactic: 'CC(O)C(=O)O',
  succinate: '[O-]C(=O)CCC(=O)[O-]',
  succinateAgain: 'C(CC(=O)[O-])C(=O)[O-]',
  broken: 'C1CC',
};

function records(): LoadedRecord[] {
  return Object.entries(SMILES).map(([name, smiles], i) => ({
    file: `compounds/${name}.yml`,
    id: `LX-${String(i + 1).padStart(5, '0')}`,
    record: {
      id: `LX-${String(i + 1).padStart(5, '0')}`,
      structure: { smiles },
      stereo: { form: 'unknown' },
    },
    positions: NO_POSITIONS,
    problems: [],
    origin: { kind: 'file' },
  }));
}

/** The engine with the read calls counted. */
function counting(engine: AuditEngine): { engine: AuditEngine; reads: () => number } {
  let n = 0;
  return {
    engine: {
      ...engine,
      readStructure: (text, options) => {
        n++;
        return engine.readStructure(text, options);
      },
    },
    reads: () => n,
  };
}

describe('registry view', () => {
  it('finds the same records by heavy atoms as by formula, reading fewer structures', async () => {
    const real = await defaultEngine();
    const regs = records();
    const keys = regs.map((r) => {
      const read = real.readStructure(r.record!.structure.smiles!, { format: 'smiles' });
      return read.ok ? real.describe(read.structure).constitutionKey : null;
    });
    expect(keys.filter((k) => k === null)).toHaveLength(1); // the unclosed ring
    const ids = (view: ReturnType<typeof buildRegistryView>, key: string): (string | null)[] =>
      view.withConstitution(key).map((e) => e.id);
    const quick = counting(real);
    const byFormula = counting({ ...real, smilesHeavyAtoms: undefined });
    const qView = buildRegistryView(regs, new StructureCache(quick.engine), () => false);
    const fView = buildRegistryView(regs, new StructureCache(byFormula.engine), () => false);
    expect(ids(qView, keys[2]!)).toEqual(['LX-00003', 'LX-00004', 'LX-00005']);
    expect(ids(fView, keys[2]!)).toEqual(['LX-00003', 'LX-00004', 'LX-00005']);
    // by formula every structure is read to file it; by heavy atoms only the three lactic acids, and the
    // unclosed ring (its syntax fails, so it is filed by a full read, which fails too)
    expect(byFormula.reads()).toBe(regs.length);
    expect(quick.reads()).toBe(4);
    expect(ids(qView, keys[0]!)).toEqual(['LX-00001']); // acrylic acid, not propanoic acid
    expect(ids(qView, keys[5]!)).toEqual(['LX-00006', 'LX-00007']);
    for (const k of keys) if (k !== null) expect(ids(qView, k)).toEqual(ids(fView, k));
  });

  it('with one record (a bulk item) answers from its facts, without reading it again', async () => {
    const real = await defaultEngine();
    const one = records().slice(2, 3); // (R)-lactic acid
    const counted = counting(real);
    let syntaxOnly = 0;
    const engine: AuditEngine = {
      ...counted.engine,
      smilesHeavyAtoms: (smiles) => (syntaxOnly++, real.smilesHeavyAtoms!(smiles)),
    };
    const cache = new StructureCache(engine);
    const view = buildRegistryView(one, cache, () => true);
    const own = cache.main(one[0]!).facts!.constitutionKey;
    expect(counted.reads()).toBe(1);
    expect(view.withConstitution(own).map((e) => e.id)).toEqual(['LX-00003']);
    const propanoic = real.readStructure(SMILES.propanoic, { format: 'smiles' });
    if (!propanoic.ok) throw new Error('propanoic acid must read');
    expect(view.withConstitution(real.describe(propanoic.structure).constitutionKey)).toEqual([]);
    expect(counted.reads()).toBe(1);
    expect(syntaxOnly).toBe(0);
  });
});

describe.skipIf(!haveSharedData('moleculenet'))('heavy atoms from SMILES syntax on MoleculeNet', () => {
  it('are among the readings of the formula of the structure as read (Wu et al., Chem. Sci. 2018, 9, 513)', async () => {
    const engine = await defaultEngine();
    const rows = loadMoleculeNet().slice(0, 3000);
    let compared = 0;
    for (const { smiles } of rows) {
      const read = engine.readStructure(smiles, { format: 'smiles' });
      if (!read.ok) continue;
      const quick = engine.smilesHeavyAtoms!(smiles);
      expect(quick, smiles).not.toBeNull();
      expect(heavyAtomCandidates(engine.formula!(read.structure)), smiles).toContain(quick);
      compared++;
    }
    expect(compared).toBeGreaterThan(2500);
  });
});
