/**
 * Solvent names folded for comparing the rotations of an enantiomer pair (issue 12): `CHCl3` and `chloroform`
 * are one solvent, so the rotations are compared; two rotations that cannot be compared get a note that says why.
 * Table: common laboratory solvent names, formulas and abbreviations — common practice, no source.
 * Enantiomers measured alike have equal and opposite specific rotations (IUPAC Gold Book, enantiomer / optical
 * activity); menthol: (−)-(1R,2S,5R) about −50° in ethanol (handbook, from memory).
 */
import { describe, expect, it } from 'vitest';
import {
  compareWithRegistry,
  consistentWithRegistry as check,
} from '../../src/checks/consistent-with-registry.js';
import { compareSolvents, rotationsComparable, solventName } from '../../src/checks/solvents.js';
import type { CompoundRecord, Rotation } from '../../src/registry/types.js';
import { render } from '../../src/checks/words.js';
import { ids, record } from './facts.js';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import type { IndexRow } from '../../src/registry/keys.js';

const rot = (value: number, solvent: string | undefined, p: Partial<Rotation> = {}): Rotation => ({
  value,
  wavelength_nm: 589,
  temperature_c: 20,
  ...(solvent === undefined ? {} : { solvent }),
  ...p,
});

describe('solvent names', () => {
  it('names, formulas and abbreviations of one solvent fold together; different solvents stay apart', () => {
    for (const s of ['CHCl3', 'chloroform', 'Chloroform', ' CHCl₃ ', 'trichloromethane'])
      expect([s, solventName(s)]).toEqual([s, 'chloroform']);
    expect(compareSolvents('CHCl3', 'chloroform')).toBe('same');
    expect(compareSolvents('MeOH', 'methanol')).toBe('same');
    expect(compareSolvents('EtOH', 'C2H5OH')).toBe('same');
    expect(compareSolvents('DMSO', 'dimethyl sulfoxide')).toBe('same');
    expect(compareSolvents('CHCl3', 'MeOH')).toBe('different');
    // deuterated solvents are other solvents
    expect(compareSolvents('CDCl3', 'CHCl3')).toBe('different');
    // outside the table: the same text is the same solvent, other texts cannot be told
    expect(compareSolvents('6 M HCl', '6 m  hcl')).toBe('same');
    expect(compareSolvents('6 M HCl', '5 N HCl')).toBe('unknown');
  });
  it('says why two rotations cannot be compared', () => {
    expect(rotationsComparable(rot(-50, 'CHCl3'), rot(48, 'chloroform'))).toEqual({ alike: true });
    expect(rotationsComparable(rot(-50, 'CHCl3'), rot(48, 'MeOH'))).toMatchObject({
      alike: false,
      reason: 'measured in different solvents (CHCl3 and MeOH)',
    });
    expect(rotationsComparable(rot(-50, 'EtOH'), rot(48, 'EtOH', { wavelength_nm: 546 }))).toMatchObject({
      alike: false,
      reason: expect.stringMatching(/different wavelengths \(589 nm and 546 nm\)/),
    });
    expect(rotationsComparable(rot(-50, 'EtOH'), rot(48, undefined))).toMatchObject({ alike: false });
    expect(
      rotationsComparable(rot(-50, 'EtOH', { temperature_c: 20 }), rot(48, 'EtOH', { temperature_c: 30 })),
    ).toMatchObject({ alike: false, reason: expect.stringMatching(/5 °C apart/) });
  });
});

describe('consistent-with-registry: rotations of an enantiomer pair in differently spelled solvents', () => {
  const menthol = (id: string, r: Rotation): CompoundRecord =>
    record({ form: 'single-enantiomer', rotation: r }, { id, name: `menthol ${id}` });
  // the two rows are enantiomers by their keys (menthol: (1R,2S,5R) and (1S,2R,5S)); registered rows as the
  // registry-wide phase sees them
  const row = (r: CompoundRecord, seq: number, stereo: string, mirror: string): IndexRow => ({
    seq,
    id: r.id,
    file: `compounds/${r.id}.yml`,
    name: r.name ?? null,
    form: r.stereo.form,
    rotation: r.stereo.rotation ?? null,
    keys: { constitution: 'C10H20O/x', kind: 'as-drawn', stereo, mirror, chiral: true, exact: true },
    lines: { id: 1, structure: 3, rotation: 7 },
    waivers: [],
  });
  const run = (mine: Rotation, theirs: Rotation) => {
    const me = row(menthol('LX-00023', mine), 2, 'a', 'b');
    const other = row(menthol('LX-00012', theirs), 1, 'b', 'a');
    return compareWithRegistry(me, [{ other, relation: 'enantiomers' }], 'review', DEFAULT_CONFIG);
  };
  it('CHCl3 vs chloroform with the same sign: the conflict is found (before: nothing said)', () => {
    expect(ids(run(rot(-49, 'CHCl3'), rot(-50, 'chloroform')))).toContain('enantiomer-rotation-same-sign');
    // opposite signs in the same solvent spelled two ways: no conflict
    expect(ids(run(rot(49, 'CHCl3'), rot(-50, 'chloroform')))).not.toContain('enantiomer-rotation-same-sign');
  });
  it('rotations that cannot be compared get a note saying why, never silence', () => {
    const o = run(rot(-49, 'CHCl3'), rot(-50, 'MeOH'));
    expect(ids(o)).toContain('enantiomer-rotations-not-compared');
    const f = o.findings.find((x) => x.messageId === 'enantiomer-rotations-not-compared')!;
    expect(f.severity).toBe('note');
    expect(render(check.messages[f.messageId], f.data)).toMatch(
      /were not compared: they were measured in different solvents \(CHCl3 and MeOH\)/,
    );
    expect(ids(run(rot(-49, '6 M HCl'), rot(-50, '5 N HCl')))).toContain('enantiomer-rotations-not-compared');
    // compared, no note
    expect(ids(run(rot(49, 'EtOH'), rot(-50, 'ethanol')))).not.toContain('enantiomer-rotations-not-compared');
  });
});
