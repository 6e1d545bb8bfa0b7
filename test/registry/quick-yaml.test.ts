/**
 * The fast record reader against the full YAML parser (the `yaml` package, YAML 1.2.2, used by parse.ts) as the
 * oracle: whenever the fast path accepts a text it must give the same value and the same field positions; it
 * may decline anything. Scalar forms follow the YAML 1.2.2 core schema (spec section 10.3.2).
 */
import fc from 'fast-check';
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { isDeepStrictEqual } from 'node:util';
import { describe, expect, it } from 'vitest';
import { parseDocumentText, parseFullText } from '../../src/registry/parse.js';
import { PositionMap } from '../../src/registry/positions.js';
import { quickParse } from '../../src/registry/quick-yaml.js';

function agrees(text: string): { accepted: boolean; same: boolean } {
  const quick = quickParse(text);
  if (quick === null) return { accepted: false, same: true };
  const full = parseFullText(text);
  const same =
    full.problems.length === 0 &&
    isDeepStrictEqual(quick.value, full.value) &&
    isDeepStrictEqual(quick.positions.entries(), (full.positions as PositionMap).entries());
  return { accepted: true, same };
}

const SCALARS = [
  'LX-00001',
  '12',
  '-0',
  '+5',
  '007',
  '1.5',
  '-12.0',
  '1.',
  '.5',
  '1e5',
  '2.5E-3',
  '0o17',
  '0x1F',
  '.inf',
  '-.inf',
  '.nan',
  '~',
  'null',
  'Null',
  'NULL',
  'true',
  'True',
  'FALSE',
  'yes',
  'no',
  'a #b',
  'a# b',
  'a: b',
  'a:b',
  'C#N',
  'a:',
  '(±)-2,3-dibromobutane',
  '[x]',
  'x[1]',
  '{a}',
  '- x',
  '-',
  '-x',
  '?x',
  ':x',
  '&a',
  '*a',
  '!t',
  '|',
  '>',
  '%x',
  '@x',
  '`x',
  "it's",
  'say "hi"',
  'back\\slash',
  'tab\tin',
  'C[C@H](O)CC',
  'F/C=C/F',
  'x  y',
  '50:50',
  '1_000',
  '1.2.3',
  'é',
  '2-methylcyclohexan-1-ol',
];
const KEYS = ['id', 'name', 'form', 'null', 'true', 'a-b', 'wavelength_nm', 'x', 'Yes', '_p', '1a', 'k k'];

const scalarText = fc
  .tuple(fc.constantFrom(...SCALARS), fc.constantFrom('plain', 'double', 'single'))
  .map(([s, style]) =>
    style === 'plain'
      ? s
      : style === 'double'
        ? `"${s.replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`
        : `'${s.replace(/'/g, "''")}'`,
  );
const comment = fc.constantFrom('', ' # note', '  #x', '#x');

type Node =
  | { kind: 'scalar'; text: string }
  | { kind: 'map'; pairs: [string, Node][] }
  | { kind: 'list'; items: Node[] };
const node: fc.Arbitrary<Node> = fc.letrec<{ node: Node }>((tie) => ({
  node: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    scalarText.map((text) => ({ kind: 'scalar' as const, text })),
    fc
      .array(fc.tuple(fc.constantFrom(...KEYS), tie('node')), { minLength: 1, maxLength: 4 })
      .map((pairs) => ({ kind: 'map' as const, pairs })),
    fc.array(tie('node'), { minLength: 1, maxLength: 3 }).map((items) => ({ kind: 'list' as const, items })),
  ),
})).node;

/** Renders a node as block YAML, with choices of indentation, comments and blank lines drawn from `pick`. */
function render(n: Node, indent: number, pick: () => number, out: string[], lead?: string): void {
  const pad = ' '.repeat(indent);
  const extra = (): void => {
    const r = pick() % 6;
    if (r === 0) out.push('');
    else if (r === 1) out.push(`${' '.repeat(pick() % 5)}# comment`);
  };
  if (n.kind === 'map') {
    n.pairs.forEach(([k, v], i) => {
      const head = i === 0 && lead !== undefined ? lead : pad;
      extra();
      if (v.kind === 'scalar') out.push(`${head}${k}: ${v.text}${['', ' # c', '  ', ''][pick() % 4]}`);
      else if (v.kind === 'list' && v.items.every((x) => x.kind === 'scalar') && pick() % 2 === 0) {
        const sep = [', ', ',', ' , '][pick() % 3];
        const items = v.items.map((x) => (x as { text: string }).text);
        out.push(
          `${head}${k}: [${pick() % 2 ? ' ' : ''}${items.join(sep)}]${['', ' # c', '#c'][pick() % 3]}`,
        );
      } else {
        out.push(`${head}${k}:${pick() % 3 === 0 ? ' # c' : ''}`);
        const step = v.kind === 'list' && pick() % 2 === 0 ? 0 : 1 + (pick() % 3);
        render(v, indent + step, pick, out);
      }
    });
  } else if (n.kind === 'list') {
    for (const item of n.items) {
      extra();
      const gap = ' '.repeat(1 + (pick() % 2));
      if (item.kind === 'scalar') out.push(`${pad}-${gap}${item.text}`);
      else if (item.kind === 'map') render(item, indent + 1 + gap.length, pick, out, `${pad}-${gap}`);
      else {
        out.push(`${pad}-`);
        render(item, indent + 2, pick, out);
      }
    }
  } else out.push(`${pad}${n.text}`);
}

describe('quickParse', () => {
  it('agrees with the full parser on every fixture and test record file it accepts', () => {
    const files: string[] = [];
    const walk = (d: string): void => {
      for (const e of readdirSync(d, { withFileTypes: true })) {
        const p = join(d, e.name);
        if (e.isDirectory()) walk(p);
        else if (/\.(ya?ml|json)$/.test(e.name)) files.push(p);
      }
    };
    walk('fixtures');
    for (const f of files) {
      const r = agrees(readFileSync(f, 'utf8'));
      expect(r.same, f).toBe(true);
      // the demo YAML files are all of the plain shape; JSON files go to the full parser
      expect(r.accepted, f).toBe(f.endsWith('.json') ? false : true);
    }
  });

  it('agrees with the full parser on generated block documents (property)', () => {
    let accepted = 0;
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.constantFrom(...KEYS), node), { minLength: 1, maxLength: 5 }),
        fc.array(fc.nat(), { minLength: 16, maxLength: 16 }),
        comment,
        (pairs, picks, top) => {
          let k = 0;
          const pick = (): number => picks[k++ % picks.length]!;
          const out: string[] = top === '' ? [] : [top.trim()];
          render({ kind: 'map', pairs }, 0, pick, out);
          const text = `${out.join('\n')}\n`;
          const r = agrees(text);
          if (r.accepted) accepted++;
          return r.same;
        },
      ),
      { numRuns: 1500 },
    );
    expect(accepted).toBeGreaterThan(50);
  });

  it('reads a typical record, numbers and comments included', () => {
    const text =
      '# a comment\nid: LX-00001\nname: (±)-carvone # trailing\nstructure:\n  smiles: "CC1=CCC(CC1=O)C(=C)C"\n' +
      'stereo:\n  form: racemate\n  rotation:\n    value: -12.0\n    temperature_c: 20\n  evidence:\n  - NMR\n  - "HPLC"\n';
    const q = quickParse(text);
    expect(q?.value).toEqual({
      id: 'LX-00001',
      name: '(±)-carvone',
      structure: { smiles: 'CC1=CCC(CC1=O)C(=C)C' },
      stereo: { form: 'racemate', rotation: { value: -12, temperature_c: 20 }, evidence: ['NMR', 'HPLC'] },
    });
    expect(q?.positions.get('stereo.rotation.value')).toEqual({ line: 9, column: 5 });
    expect(q?.positions.get('stereo.evidence.1')).toEqual({ line: 13, column: 5 });
    expect(agrees(text)).toEqual({ accepted: true, same: true });
  });

  it('declines what it does not read, and parseDocumentText still reports it', () => {
    for (const text of [
      'id: a\nid: b\n',
      'a: {b: 1}\n',
      'a: [1, [2]]\n',
      'a: |\n  x\n',
      'a: b\n  c\n',
      'a: 0x1F\n',
      '---\na: 1\n',
    ]) {
      expect(quickParse(text), text).toBeNull();
    }
    expect(parseDocumentText('id: a\nid: b\n').problems[0]?.code).toBe('yaml-syntax');
    expect(parseDocumentText('a: 0x1F\n').value).toEqual({ a: 31 });
  });
});
