/**
 * A stand-in engine for audit tests that must not depend on the real stereo engine: it "reads" any text without
 * a '!' (the error marker), and its facts are plain: one undefined unit per '?' and a constitution key made of the
 * text without '@' marks (so enantiomer-like pairs share a key). It proves the audit's plumbing, not chemistry.
 */
import type { StructureFacts, RelationFacts } from '../../src/chem/facts.js';
import type { ReadResult, Structure } from '../../src/chem/types.js';
import type { AuditEngine } from '../../src/audit/engine.js';

export function fakeStructure(text: string): Structure {
  return {
    atoms: [],
    bonds: [],
    stereo: [],
    groups: [],
    chiralFlag: null,
    title: text,
    properties: {},
    dimension: 0,
  };
}

export function fakeFacts(text: string): StructureFacts {
  return {
    stereocenters: [],
    stereobonds: [],
    units: [],
    chiral: text.includes('@') ? true : false,
    meso: false,
    undefined: (text.match(/\?/g) ?? []).length,
    stereoisomers: { total: 1, chiral: 0, achiral: 1, pairs: 0, meso: 0, units: 0 },
    mirror: { chiral: false, fixedAtoms: [], fixedBonds: [], explanation: 'fake' },
    enhanced: { groups: [], meaning: 'none' },
    invertibleNitrogens: [],
    components: [],
    constitutionKey: text.replace(/@/g, ''),
    formula: 'C1',
    remarks: [],
  };
}

export interface FakeEngine extends AuditEngine {
  describeCalls: string[];
}

export function fakeEngine(): FakeEngine {
  const describeCalls: string[] = [];
  return {
    describeCalls,
    readStructure(text: string): ReadResult {
      const bad = text.indexOf('!');
      if (bad >= 0)
        return {
          ok: false,
          error: { code: 'fake-bad', message: 'bad character', at: { offset: bad, line: 1 } },
        };
      return { ok: true, structure: fakeStructure(text.trim()), warnings: [] };
    },
    describe(s: Structure): StructureFacts {
      describeCalls.push(s.title ?? '');
      if ((s.title ?? '').includes('BOOM')) throw new Error('describe exploded');
      return fakeFacts(s.title ?? '');
    },
    relate(): RelationFacts {
      return {
        relation: 'identical',
        differingUnits: [],
        relabelledUnits: [],
        epimers: false,
        otherComponents: { onlyInA: [], onlyInB: [] },
        formDifferences: [],
        explanation: 'fake',
      };
    },
  };
}
