/**
 * The registry index stays linear when a registry holds many copies of one structure (a legacy export often does):
 * copies of one stereoisomer share a class, so a lookup visits classes, not rows, and an inexact key costs one
 * confirmation per class. Keys here are invented strings; what is tested is the index's work, counted, not timed.
 */
import { describe, expect, it } from 'vitest';
import { RegistryIndex } from '../../src/registry/key-index.js';
import type { IndexRow, RecordKeys } from '../../src/registry/keys.js';

const row = (seq: number, keys: Partial<RecordKeys>): IndexRow =>
  ({
    seq,
    id: `LX-${seq}`,
    file: `compounds/LX-${seq}.yml`,
    name: null,
    form: 'single-enantiomer',
    rotation: null,
    keys: { constitution: 'C', kind: 'as-drawn', stereo: 'S', mirror: 'R', chiral: true, exact: true, ...keys },
    lines: { id: 1, structure: 2, rotation: null },
    waiver: null,
  }) as unknown as IndexRow;

describe('registry index with many copies', () => {
  it('2,000 copies of one exact key: each record matches the earliest copy only', () => {
    const index = new RegistryIndex();
    let found = 0;
    for (let i = 0; i < 2000; i++) {
      const r = row(i, {});
      const m = index.matches(r);
      found += m.length;
      if (i > 0) expect(m.map((x) => x.other.seq)).toEqual([0]);
      index.add(r);
    }
    expect(found).toBe(1999);
  });

  it('inexact keys: confirmations grow with the records, not with their pairs', () => {
    let calls = 0;
    // two stereoisomers share one inexact key; the confirmation tells them apart by their text
    const index = new RegistryIndex((a, b) => {
      calls++;
      return a.text!.text === b.text!.text ? 'identical' : 'diastereomers';
    });
    for (let i = 0; i < 1000; i++) {
      const text = { format: 'smiles' as const, text: i % 2 === 0 ? 'A' : 'B' };
      const r = row(i, { exact: false, text, mirror: 'S' });
      const m = index.matches(r);
      if (i > 1) expect(m).toHaveLength(1);
      index.add(r);
    }
    expect(calls).toBeLessThan(1000 * 6);
  });
});
