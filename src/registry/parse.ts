/**
 * One record file's text -> the record (when it passes the schema), its field positions and its problems.
 * YAML and JSON go through the same YAML parser, so both keep line numbers.
 */
import { LineCounter, parseDocument } from 'yaml';
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
export function parseDocumentText(text: string): ParsedDocument {
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
