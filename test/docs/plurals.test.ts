/**
 * No "(s)" plurals in what a person reads: every string and template literal in src/ and every line of the README,
 * docs/*.md, action.yml and schema/*.json says "1 record" or "2 records" from the count (src/checks/words.ts
 * plural(), or {count:unit|units} in message templates). House rule: plain English (common practice, no source).
 * "http(s)" is a URL scheme, not a plural.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import ts from 'typescript';
import { afterEach, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { memoryIo } from '../cli/io.js';
import { recordYaml, tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';

const PLURAL = /\b[A-Za-z]+\(s\)/g;
const found = (text: string): string[] =>
  [...text.matchAll(PLURAL)].map((m) => m[0]).filter((w) => w.toLowerCase() !== 'http(s)');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? sourceFiles(join(dir, e.name)) : e.name.endsWith('.ts') ? [join(dir, e.name)] : [],
  );
}

/** The text of every string literal and template piece of a TypeScript file, with its line. */
function literals(file: string): { line: number; text: string }[] {
  const src = ts.createSourceFile(file, readFileSync(file, 'utf8'), ts.ScriptTarget.Latest, true);
  const out: { line: number; text: string }[] = [];
  const visit = (n: ts.Node): void => {
    if (ts.isStringLiteralLike(n) || ts.isTemplateLiteralToken(n))
      out.push({ line: src.getLineAndCharacterOfPosition(n.getStart()).line + 1, text: n.text });
    n.forEachChild(visit);
  };
  visit(src);
  return out;
}

describe('no "(s)" plurals', () => {
  it('in the strings of src/', () => {
    const hits = sourceFiles('src').flatMap((f) =>
      literals(f).flatMap(({ line, text }) => found(text).map((w) => `${f}:${line}: ${w}`)),
    );
    expect(hits).toEqual([]);
  });

  it('in the README, docs/*.md, action.yml and schema/*.json', () => {
    const files = [
      'README.md',
      'action.yml',
      ...readdirSync('docs').map((f) => join('docs', f)),
      ...readdirSync('schema').map((f) => join('schema', f)),
    ];
    const hits = files.flatMap((f) =>
      readFileSync(f, 'utf8')
        .split('\n')
        .flatMap((l, i) => found(l).map((w) => `${f}:${i + 1}: ${w}`)),
    );
    expect(hits).toEqual([]);
  });
});

describe('counts in words', () => {
  let reg: TmpRegistry | null = null;
  afterEach(() => {
    reg?.remove();
    reg = null;
  });

  it("a one-record registry: the registry-wide phase says 'the keys of 1 record', not '1 records'", async () => {
    reg = tmpRegistry({ 'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CCO') });
    const io = memoryIo();
    expect(await run(['audit', '--root', reg.root, '--format', 'json'], io)).toBe(0);
    const reason = (JSON.parse(io.stdout.join('')) as { registry: { reason: string } }).registry.reason;
    expect(reason).toBe(
      'compared every record with each record before it through an index of the keys of 1 record',
    );
  });
});
