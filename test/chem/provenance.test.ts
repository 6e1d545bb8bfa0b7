/**
 * The provenance engine on textbook reactions: which stereo units of a product are carried from an input (and
 * whether their spatial configuration is kept), which are formed, which are unmapped. The reactions and their
 * stereochemical course are textbook facts written from memory (no single source); every CIP label quoted in a
 * comment was checked with RDKit's new CIP labeller (rdCIPLabeler, Debian python3-rdkit 2022.09) on the SMILES
 * given, so the drawings are what the comments say they are.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe as describeStructure, readStructure } from '../../src/chem/index.js';
import { traceProvenance, type Provenance } from '../../src/chem/provenance/index.js';
import type { Structure } from '../../src/chem/types.js';

function smi(s: string): Structure {
  const r = readStructure(s, { format: 'smiles' });
  if (!r.ok) throw new Error(`${s}: ${r.error.message}`);
  return r.structure;
}

function trace(product: string, inputs: string[]): Provenance {
  return traceProvenance(
    smi(product),
    inputs.map((s) => smi(s)),
  );
}

const fates = (p: Provenance) => p.units.map((u) => [u.atoms[0], u.fate, u.reason, u.configuration]);

suite('provenance: carried, formed, unmapped', () => {
  it('NaBH4 reduction of acetophenone: the carbinol centre is formed (from memory)', () => {
    // (R)-1-phenylethanol drawn; the ketone carbon is trigonal, no stereo unit in the input.
    const p = trace('C[C@@H](O)c1ccccc1', ['CC(=O)c1ccccc1']);
    expect(fates(p)).toEqual([[2, 'formed', 'new-unit', 'open']]);
    expect(p.units[0].input).toBe(0);
    expect(p.units[0].inputAtoms).toEqual([2]);
    expect(p.bounded).toBe(false);
    // the C=O became C–O: 8 of the 9 bonds of acetophenone are kept, all 9 atoms but O are placed
    expect(p.inputs[0]).toMatchObject({ atomsMapped: 8, bondsMapped: 8, copies: 1 });
  });

  it('MeMgBr + (S)-2-phenylpropanal: C3 carried with its configuration, C2 formed (Cram 1952, from memory)', () => {
    // aldehyde C[C@H](C=O)c1ccccc1 is (S); both products below are (3S) (atom 2), one (2S), one (2R) at atom 9
    const aldehyde = 'C[C@H](C=O)c1ccccc1';
    for (const product of ['C[C@@H](c1ccccc1)[C@H](C)O', 'C[C@@H](c1ccccc1)[C@@H](C)O']) {
      const p = trace(product, [aldehyde, 'C[Mg]Br']);
      expect(fates(p)).toEqual([
        [2, 'carried', 'bonds-kept', 'same'],
        [9, 'formed', 'new-unit', 'open'],
      ]);
      expect(p.inputs[0].relative).toBe('same');
    }
    // drawn (3R): the carried centre is inverted, which no bond at it explains
    const wrong = trace('C[C@H](c1ccccc1)[C@H](C)O', [aldehyde, 'C[Mg]Br']);
    expect(fates(wrong)[0]).toEqual([2, 'carried', 'bonds-kept', 'inverted']);
    expect(wrong.inputs[0].relative).toBe('mirror');
  });

  it('compares the arrangement, not the label: Wittig methylenation turns (S)-2-phenylpropanal into (R)-3-phenylbut-1-ene with retention (from memory)', () => {
    // RDKit: C[C@H](C=O)c1ccccc1 is (S), C[C@H](C=C)c1ccccc1 is (R): vinyl ranks below phenyl, CHO above
    const p = trace('C[C@H](C=C)c1ccccc1', ['C[C@H](C=O)c1ccccc1', 'C=P(c1ccccc1)(c1ccccc1)c1ccccc1']);
    expect(fates(p)).toEqual([[2, 'carried', 'bonds-kept', 'same']]);
    expect(describeStructure(smi('C[C@H](C=C)c1ccccc1')).stereocenters[0].label).toBe('R');
  });

  it('N-acetylation of (S)-alanine keeps the centre; the same product drawn (R) is inverted (from memory)', () => {
    const ala = 'N[C@@H](C)C(=O)O'; // (S), RDKit
    const s = trace('CC(=O)N[C@@H](C)C(=O)O', [ala, 'CC(=O)OC(C)=O']); // (S), RDKit
    expect(fates(s)).toEqual([[5, 'carried', 'bonds-kept', 'same']]);
    const r = trace('CC(=O)N[C@H](C)C(=O)O', [ala, 'CC(=O)OC(C)=O']);
    expect(fates(r)).toEqual([[5, 'carried', 'bonds-kept', 'inverted']]);
    // the anhydride is the larger input, yet alanine is placed first: its piece is the larger one
    expect(s.inputs.map((t) => t.atomsMapped)).toEqual([6, 3]);
  });

  it('Mitsunobu with phthalimide: the C–N bond at the centre is made, no carried claim (from memory)', () => {
    // (S)-octan-2-ol -> (R)-N-(octan-2-yl)phthalimide, inversion (RDKit labels)
    const p = trace('CCCCCC[C@@H](C)N1C(=O)c2ccccc2C1=O', ['CCCCCC[C@H](C)O', 'O=C1NC(=O)c2ccccc12']);
    expect(fates(p)).toEqual([[7, 'formed', 'bond-changed', 'open']]);
    expect(p.units[0].neighbour).toEqual({ atom: 9, input: 1 });
  });

  it('Mitsunobu esterification: the ester O could come from either input, so the bond at C2 may be made (from memory)', () => {
    const p = trace('CCCCCC[C@@H](C)OC(=O)c1ccc(cc1)[N+](=O)[O-]', [
      'CCCCCC[C@H](C)O',
      'OC(=O)c1ccc(cc1)[N+](=O)[O-]',
    ]);
    expect(fates(p)).toEqual([[7, 'formed', 'bond-may-be-made', 'open']]);
    expect(p.units[0].neighbour?.atom).toBe(9);
  });

  it('meso diester -> half ester: both centres carried, either enantiomer consistent (the two esters are enantiotopic) (from memory)', () => {
    const meso = 'COC(=O)[C@@H]1CC=CC[C@@H]1C(=O)OC'; // (1R,2S), RDKit
    for (const product of ['COC(=O)[C@@H]1CC=CC[C@@H]1C(=O)O', 'OC(=O)[C@@H]1CC=CC[C@@H]1C(=O)OC']) {
      const p = trace(product, [meso]);
      expect(p.units.map((u) => [u.fate, u.configuration])).toEqual([
        ['carried', 'same'],
        ['carried', 'same'],
      ]);
    }
    // a trans half ester cannot come from the cis diester without a bond at a centre changing
    const trans = trace('COC(=O)[C@@H]1CC=CC[C@H]1C(=O)O', [meso]);
    expect(trans.inputs[0].relative).toBe('mixed');
  });

  it('a unit on atoms no input supplies is unmapped', () => {
    const p = trace('C[C@@H](O)c1ccccc1', ['C=O']);
    expect(p.units[0]).toMatchObject({ fate: 'unmapped', reason: 'not-covered', input: null });
  });

  it('a double bond made by a Wittig reaction, one end from each input, is formed (from memory)', () => {
    const p = trace('C/C=C/c1ccccc1', ['O=Cc1ccccc1', 'CC=P(c1ccccc1)(c1ccccc1)c1ccccc1']);
    expect(p.units[0]).toMatchObject({
      kind: 'double-bond',
      fate: 'formed',
      reason: 'atoms-from-two-inputs',
    });
  });

  it('a search that reaches its bound reports every unit unmapped (reason bound), never a verdict', () => {
    const p = traceProvenance(smi('C[C@@H](c1ccccc1)[C@H](C)O'), [smi('C[C@H](C=O)c1ccccc1')], {
      stepBudget: 3,
    });
    expect(p.bounded).toBe(true);
    expect(p.units.every((u) => u.fate === 'unmapped' && u.reason === 'bound')).toBe(true);
    expect(p.steps).toBeLessThanOrEqual(3);
  });

  it('an input above the size limit is not searched: unmapped, reason bound', () => {
    const p = traceProvenance(smi('C[C@@H](O)c1ccccc1'), [smi('CC(=O)c1ccccc1')], { maxInputAtoms: 5 });
    expect(p.units[0]).toMatchObject({ fate: 'unmapped', reason: 'bound' });
  });

  it('two equivalents of (S)-1-phenylethylamine in a diamide: both centres carried (from memory)', () => {
    const p = trace('C[C@H](NC(=O)C(=O)N[C@@H](C)c1ccccc1)c1ccccc1', ['C[C@H](N)c1ccccc1', 'ClC(=O)C(=O)Cl']);
    expect(p.inputs[0].copies).toBe(2);
    expect(p.units.map((u) => [u.fate, u.configuration])).toEqual([
      ['carried', 'same'],
      ['carried', 'same'],
    ]);
  });
});
