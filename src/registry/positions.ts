/**
 * Source positions of every field of a YAML (or JSON, parsed by the same YAML parser) document, by dotted path:
 * 'stereo.form', 'stereo.components.1.smiles', 'waivers.0.reason'. A mapping entry stands at its key; a list item
 * at the item itself.
 */
import { isMap, isScalar, isSeq, type Document, type LineCounter, type Node } from 'yaml';
import type { FieldPositions } from './types.js';

export class PositionMap implements FieldPositions {
  private readonly map = new Map<string, { line: number; column: number }>();

  set(path: string, pos: { line: number; column: number }): void {
    if (!this.map.has(path)) this.map.set(path, pos);
  }

  get(path: string): { line: number; column: number } | undefined {
    return this.map.get(path);
  }

  /** The line of `path`, else of its nearest ancestor that exists (a missing field points at its parent). */
  lineOf(path: string | null): number | null {
    return lineOf(this, path);
  }

  get size(): number {
    return this.map.size;
  }

  /** Every known path with its position, in document order. */
  entries(): [string, { line: number; column: number }][] {
    return [...this.map];
  }
}

/** Line of a field, falling back to the nearest ancestor present; null when nothing is known. */
export function lineOf(positions: FieldPositions, path: string | null): number | null {
  if (path === null) return null;
  let p = path;
  for (;;) {
    const pos = positions.get(p);
    if (pos) return pos.line;
    if (p === '') return null;
    const cut = p.lastIndexOf('.');
    p = cut < 0 ? '' : p.slice(0, cut);
  }
}

/** Positions with nothing in them (for records that did not come from a parsed file). */
export const NO_POSITIONS: FieldPositions = { get: () => undefined };

function keyText(key: unknown): string {
  if (isScalar(key)) return String(key.value);
  return String(key);
}

export function positionsOf(doc: Document, counter: LineCounter): PositionMap {
  const positions = new PositionMap();
  const put = (path: string, node: { range?: [number, number, number] | null } | null | undefined): void => {
    const start = node?.range?.[0];
    if (start === undefined) return;
    const { line, col } = counter.linePos(start);
    positions.set(path, { line, column: col });
  };
  const walk = (node: unknown, path: string, depth: number): void => {
    if (depth > 64) return;
    if (isMap(node)) {
      for (const pair of node.items) {
        const childPath = path === '' ? keyText(pair.key) : `${path}.${keyText(pair.key)}`;
        put(childPath, (pair.key as Node | null) ?? (pair.value as Node | null));
        walk(pair.value, childPath, depth + 1);
      }
    } else if (isSeq(node)) {
      node.items.forEach((item, i) => {
        const childPath = path === '' ? String(i) : `${path}.${i}`;
        put(childPath, item as Node | null);
        walk(item, childPath, depth + 1);
      });
    }
  };
  put('', doc.contents as Node | null);
  if (positions.get('') === undefined) positions.set('', { line: 1, column: 1 });
  walk(doc.contents, '', 0);
  return positions;
}
