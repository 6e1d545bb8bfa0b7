/**
 * The registry index: every record's keys (keys.ts), filed by constitution + stereo key. A record finds the
 * records identical to it with one lookup (its own stereo key) and its enantiomers with another (its mirror key),
 * so the registry-wide checks cost a constant per record, never record against record. Inexact keys (keys.ts)
 * are confirmed by `confirm` (the engine's relate() on the kept structure texts); a pair without both texts is
 * not a pair (an exact key is never an inexact key's partner, see keys.ts).
 */
import type { IndexRow, RecordKeys } from './keys.js';

export type KeyRelation = 'identical' | 'enantiomers';

export interface KeyMatch {
  other: IndexRow;
  relation: KeyRelation;
}

/** relate() of two inexact keys' structures: 'identical', 'enantiomers', or anything else (no pair). */
export type Confirm = (a: RecordKeys, b: RecordKeys) => string | null;

export class RegistryIndex {
  private readonly byKey = new Map<string, IndexRow[]>();
  /** Rows filed (records with a stereo key). */
  size = 0;

  constructor(private readonly confirm: Confirm | null = null) {}

  add(row: IndexRow): void {
    const k = row.keys;
    if (k === null || k.stereo === null) return;
    const key = `${k.constitution}#${k.stereo}`;
    const list = this.byKey.get(key);
    if (list) list.push(row);
    else this.byKey.set(key, [row]);
    this.size++;
  }

  /** Removes a row added before (a record file replaced by its new version). */
  remove(row: IndexRow): void {
    const k = row.keys;
    if (k === null || k.stereo === null) return;
    const key = `${k.constitution}#${k.stereo}`;
    const list = this.byKey.get(key);
    const at = list ? list.indexOf(row) : -1;
    if (at < 0) return;
    list!.splice(at, 1);
    if (list!.length === 0) this.byKey.delete(key);
    this.size--;
  }

  /** Records identical to `me` or its enantiomers, in the order they were added; `me` itself left out. */
  matches(me: IndexRow): KeyMatch[] {
    const k = me.keys;
    if (k === null || k.stereo === null || k.mirror === null) return [];
    const out: KeyMatch[] = [];
    const consider = (key: string, expected: KeyRelation): void => {
      for (const other of this.byKey.get(`${k.constitution}#${key}`) ?? []) {
        if (other === me || (other.file === me.file && other.seq === me.seq)) continue;
        const relation = other.keys && this.relationOf(k, other.keys, expected);
        if (relation && !out.some((m) => m.other === other)) out.push({ other, relation });
      }
    };
    consider(k.stereo, 'identical');
    // an achiral drawing is its own mirror image: its mirror key finds the identical records again
    if (k.mirror !== k.stereo) consider(k.mirror, 'enantiomers');
    out.sort((a, b) => a.other.seq - b.other.seq);
    return out;
  }

  private relationOf(a: RecordKeys, b: RecordKeys, expected: KeyRelation): KeyRelation | null {
    if (a.exact && b.exact) return expected;
    if (!a.text || !b.text || !this.confirm) return null;
    const r = this.confirm(a, b);
    return r === 'identical' || r === 'enantiomers' ? r : null;
  }
}
