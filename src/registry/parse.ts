/**
 * One record file's text -> the record (when it passes the schema), its field positions and its problems.
 * YAML and JSON go through the same YAML parser, so both keep line numbers.
 */
import { LineCounter, isNode, isPair, isScalar, parseDocument, visit, type Document, type Node } from 'yaml';
import { PositionMap, lineOf, positionsOf } from './positions.js';
import { quickParse } from './quick-yaml.js';
import { validateRecordShape } from './schema.js';
import type { CompoundRecord, LoadedRecord } from './types.js';

export type Problem = LoadedRecord['problems'][number];

export interface ParsedRecord {
  value: unknown;
  record: CompoundRecord | null;
  id: string | null;
  positions: PositionMap;
  problems: Problem[];
}

export interface ParsedDocument {
  value: unknown;
  positions: PositionMap;
  problems: Problem[];
}

/**
 * Parses YAML or JSON text, keeping positions; syntax errors become problems with their line. Text of the plain
 * shape most record files have takes the fast path (quick-yaml.ts), with the same result.
 */
export function parseDocumentText(raw: string): ParsedDocument {
  // CR-only and CRLF line ends read as LF, so every line number counts the lines an editor shows
  const text = raw.includes('\r') ? raw.replace(/\r\n?/g, '\n') : raw;
  const quick = quickParse(text);
  if (quick) return { value: quick.value, positions: quick.positions, problems: [] };
  return parseFullText(text);
}

/** parseDocumentText by the full YAML parser only. */
export function parseFullText(text: string): ParsedDocument {
  const counter = new LineCounter();
  const doc = parseDocument(text, {
    lineCounter: counter,
    prettyErrors: true,
    uniqueKeys: true,
    version: '1.2',
  });
  const positions = positionsOf(doc, counter);
  const problems: Problem[] = [];
  for (const err of doc.errors) {
    const line = err.linePos?.[0]?.line ?? counter.linePos(err.pos[0]).line;
    const first = err.message.split('\n')[0] ?? err.message;
    problems.push({
      path: '',
      line,
      code: 'yaml-syntax',
      message: `not valid YAML/JSON: ${first.replace(/ at line \d+, column \d+:?$/, '')}`,
    });
  }
  problems.push(...tagProblems(doc, counter));
  if (problems.length > 0) return { value: null, positions, problems };
  let value: unknown;
  try {
    value = doc.toJS({ maxAliasCount: 50 });
  } catch (e) {
    return {
      value: null,
      positions,
      problems: [
        { path: '', line: 1, code: 'yaml-syntax', message: `cannot be read: ${(e as Error).message}` },
      ],
    };
  }
  return { value, positions, problems };
}

/** The tags of the YAML 1.2 core schema: plain JSON values. Any other tag (!foo, !!binary, !!set) is a problem. */
const PLAIN_TAGS = new Set(
  ['str', 'int', 'float', 'bool', 'null', 'map', 'seq'].map((t) => `tag:yaml.org,2002:${t}`),
);

/** Tags outside the core schema, tags that did not resolve, and keys that are not scalars: one problem each. */
function tagProblems(doc: Document, counter: LineCounter): Problem[] {
  const out: Problem[] = [];
  const lineAt = (node: { range?: [number, number, number] | null } | null | undefined): number =>
    counter.linePos(node?.range?.[0] ?? 0).line;
  for (const w of doc.warnings) {
    // a value that does not fit its core tag (`!!int CCO`); other tags are reported node by node below
    if (w.code !== 'TAG_RESOLVE_FAILED' || !w.message.includes('tag:yaml.org,2002:')) continue;
    const line = w.linePos?.[0]?.line ?? counter.linePos(w.pos[0]).line;
    const first = (w.message.split('\n')[0] ?? w.message)
      .replace('tag:yaml.org,2002:', '!!')
      .replace(/ at line \d+, column \d+:?$/, '');
    out.push({ path: '', line, code: 'unknown-tag', message: `not plain YAML/JSON: ${first}` });
  }
  visit(doc, {
    Node(key, node, path) {
      const tag = (node as Node).tag;
      if (tag !== undefined && !PLAIN_TAGS.has(tag)) {
        // the tag stands after its key (`structure: !foo`), also when the tagged mapping starts a line later
        const parent = path[path.length - 1];
        const at = key === 'value' && isPair(parent) && isNode(parent.key) ? parent.key : node;
        out.push({
          path: '',
          line: lineAt(at),
          code: 'unknown-tag',
          message: `the YAML tag ${tag.replace('tag:yaml.org,2002:', '!!')} is not allowed in a record (plain YAML/JSON values only)`,
        });
      }
    },
    Pair(_key, pair) {
      if (pair.key !== null && !isScalar(pair.key)) {
        out.push({
          path: '',
          line: lineAt(pair.key as Node),
          code: 'yaml-syntax',
          message: 'not valid here: a field name must be a plain word, not a list or mapping',
        });
      }
    },
  });
  return out;
}

export function parseRecordText(text: string): ParsedRecord {
  const parsed = parseDocumentText(text);
  const { value, positions } = parsed;
  if (parsed.problems.length > 0)
    return { value, record: null, id: null, positions, problems: parsed.problems };
  if (value === null || value === undefined) {
    return {
      value,
      record: null,
      id: null,
      positions,
      problems: [{ path: '', line: 1, code: 'empty-file', message: 'the file is empty' }],
    };
  }
  const id =
    typeof value === 'object' && !Array.isArray(value) && typeof (value as { id?: unknown }).id === 'string'
      ? (value as { id: string }).id.trim() || null
      : null;
  const shape = validateRecordShape(value);
  const problems = shape.map((p) => ({
    path: p.path,
    message: p.message,
    line: lineOf(positions, p.path),
    code: p.code,
  }));
  problems.sort((a, b) => (a.line ?? 0) - (b.line ?? 0));
  return { value, record: problems.length === 0 ? (value as CompoundRecord) : null, id, positions, problems };
}
