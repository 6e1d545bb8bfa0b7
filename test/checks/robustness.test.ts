import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { CHECKS } from '../../src/checks/index.js';
import { STEREO_FORMS } from '../../src/registry/types.js';
import { parseDescriptors } from '../../src/chem/descriptors.js';
import { parseRatio } from '../../src/checks/ratio.js';
import {
  assertRenderable,
  centre,
  chiralFacts,
  ctx,
  facts,
  failedRead,
  read,
  record,
  unit,
} from './facts.js';

// Bad input is data: no check throws on any record, and every finding fills its template.
const FACTS = [
  read(facts()),
  read(chiralFacts([centre(2, 'R', 2), centre(3, null, 3)])),
  read(facts({ units: [unit({ atoms: [2], defined: false })], chiral: null, meso: null })),
  read(
    facts({
      invertibleNitrogens: [{ atom: 1, drawnWithStereo: true }],
      enhanced: { groups: [{ type: 'or', id: 1, atoms: [2] }], meaning: 'relative' },
    }),
  ),
  failedRead('broken', 3, null),
];

describe('checks never throw', () => {
  it('on arbitrary descriptors, names, ratios, ee and rotations, for every form', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...STEREO_FORMS),
        fc.option(fc.string(), { nil: undefined }),
        fc.option(fc.string(), { nil: undefined }),
        fc.option(fc.string(), { nil: undefined }),
        fc.option(fc.double({ min: 0, max: 100, noNaN: true }), { nil: undefined }),
        fc.option(fc.double({ min: -500, max: 500, noNaN: true }), { nil: undefined }),
        fc.nat(FACTS.length - 1),
        (form, descriptors, name, ratio, ee, rot, k) => {
          const r = record(
            { form, descriptors, ratio, ee, rotation: rot === undefined ? undefined : { value: rot } },
            { name, waivers: [{ check: 'rotation-consistent' }] },
          );
          for (const c of CHECKS) {
            const o = c.run(ctx({ record: r, main: FACTS[k], components: [FACTS[k]], findings: [] }));
            assertRenderable(c, o);
          }
        },
      ),
      { numRuns: 300 },
    );
  });
  it('on a record that failed the schema (record null)', () => {
    for (const c of CHECKS)
      for (const m of FACTS) expect(() => c.run(ctx({ record: null, main: m, findings: [] }))).not.toThrow();
  });
  it('the parsers return problems, not exceptions', () => {
    fc.assert(
      fc.property(fc.string(), (s) => {
        expect(() => parseDescriptors(s)).not.toThrow();
        expect(() => parseDescriptors(s, { context: 'name' })).not.toThrow();
        expect(() => parseRatio(s)).not.toThrow();
      }),
      { numRuns: 1000 },
    );
  });
});
