import { describe, expect, it } from 'vitest';
import { rotationConsistent as check } from '../../src/checks/rotation-consistent.js';
import type { Rotation } from '../../src/registry/types.js';
import { ctx, ids, record, runCheck } from './facts.js';

// Optical activity (IUPAC Gold Book): achiral and meso compounds are optically inactive; a racemate's
// enantiomers cancel. Carvone: (R)-(−) and (S)-(+), [α]D about ±61 (neat) — handbook value, from memory.
// zeroRotationTolerance default 1° (from memory: polarimeter resolution, see src/audit/config.ts).
const rot = (value: number, p: Partial<Rotation> = {}): Rotation => ({
  value,
  wavelength_nm: 589,
  temperature_c: 20,
  ...p,
});
const run = (stereo: Parameters<typeof record>[0], name?: string) =>
  runCheck(check, ctx({ record: record(stereo, name ? { name } : {}) }));

describe('rotation-consistent', () => {
  it('does not apply without a rotation', () => {
    expect(run({ form: 'single-enantiomer' }, '(S)-(+)-carvone').notApplicable).toBe(
      'no rotation given (stereo.rotation)',
    );
  });
  it('a racemate, meso or achiral compound has zero rotation', () => {
    expect(run({ form: 'racemate', rotation: rot(0.3) }).findings).toEqual([]);
    for (const form of ['racemate', 'meso', 'achiral'] as const) {
      const o = run({ form, rotation: rot(-12.4) });
      expect([form, ids(o)]).toEqual([form, ['rotation-should-be-zero']]);
    }
  });
  it('the (+)/(−) prefix agrees with the sign of the rotation', () => {
    expect(run({ form: 'single-enantiomer', rotation: rot(61) }, '(S)-(+)-carvone').findings).toEqual([]);
    const o = run({ form: 'single-enantiomer', rotation: rot(-61) }, '(S)-(+)-carvone');
    expect(o.findings).toMatchObject([{ messageId: 'sign-disagrees-with-rotation', field: 'name' }]);
    expect(o.findings[0].severity).toBeUndefined(); // the check's default, error
    expect(ids(run({ form: 'single-enantiomer', descriptors: '(R)-(−)', rotation: rot(61) }))).toEqual([
      'sign-disagrees-with-rotation',
    ]);
  });
  it('a sign disagreement away from the sodium D line is only a note (optical rotatory dispersion)', () => {
    const o = run(
      { form: 'single-enantiomer', rotation: rot(-20, { wavelength_nm: 365 }) },
      '(S)-(+)-carvone',
    );
    expect(o.findings).toMatchObject([{ messageId: 'sign-disagrees-with-rotation', severity: 'note' }]);
  });
  it('a sign with a zero rotation is a warning', () => {
    expect(ids(run({ form: 'single-enantiomer', rotation: rot(0.2) }, '(+)-x'))).toContain(
      'sign-with-zero-rotation',
    );
  });
  it('a single enantiomer with zero rotation gets a note', () => {
    const o = run({ form: 'single-enantiomer', rotation: rot(0) });
    expect(o.findings).toMatchObject([{ messageId: 'single-enantiomer-zero-rotation', severity: 'note' }]);
    expect(o.passed).toBeDefined();
  });
});
