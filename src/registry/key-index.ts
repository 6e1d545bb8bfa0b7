/**
 * The registry index: every record's keys (keys.ts), filed by constitution + stereo key. A record finds the
 * records identical to it with one lookup (its own stereo key) and its enantiomers with another (its mirror key),
 * so the registry-wide checks cost a constant per record, never record against record; copies of one stereoisomer
 * share a class (below), so a registry with many copies stays linear. Inexact keys (keys.ts)
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

/**
 * The rows of one key that are one stereoisomer: a class. Exact keys make one class per key; inexact keys are
 * split into classes by `confirm` against each class's first row. A lookup visits classes, not rows, so many
 * copies of one structure cost a constant each (a record is reported against the earliest of its class).
 */
interface StereoClass {
  rows: IndexRow[];
}

export class RegistryIndex {
  private readonly byKey = new Map<string, StereoClass[]>();
  /** Rows filed (records with a stereo key). */
  size = 0;

  constructor(private readonly confirm: Confirm | null = null) {}

  add(row: IndexRow): void {
    const k = row.keys;
    if (k === null || k.stereo === null) return;
    const key = `${k.constitution}#${k.stereo}`;
    const classes = this.byKey.get(key);
    if (!classes) this.byKey.set(key, [{ rows: [row] }]);
    else {
      const same = classes.find((c) => this.relationOf(k, c.rows[0].keys!, 'identical') === 'identical');
      if (same) same.rows.push(row);
      else classes.push({ rows: [row] });
    }
    this.size++;
  }

  /** Removes a row added before (a record file replaced by its new version). */
  remove(row: IndexRow): void {
    const k = row.keys;
    if (k === null || k.stereo === null) return;
    const key = `${k.constitution}#${k.stereo}`;
    const classes = this.byKey.get(key);
    if (!classes) return;
    for (let ci = 0; ci < classes.length; ci++) {
      const at = classes[ci].rows.indexOf(row);
      if (at < 0) continue;
      classes[ci].rows.splice(at, 1);
      if (classes[ci].rows.length === 0) classes.splice(ci, 1);
      if (classes.length === 0) this.byKey.delete(key);
      this.size--;
      return;
    }
  }

  /**
   * Records identical to `me` or its enantiomers: the earliest record of each matching class, in the order they
   * were added; `me` itself left out.
   */
  matches(me: IndexRow): KeyMatch[] {
    const k = me.keys;
    if (k === null || k.stereo === null || k.mirror === null) return [];
    const out: KeyMatch[] = [];
    const consider = (key: string, expected: KeyRelation): void => {
      for (const c of this.byKey.get(`${k.constitution}#${key}`) ?? []) {
        const other = c.rows.find((o) => o !== me && !(o.file === me.file && o.seq === me.seq));
        if (!other) continue;
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
