/**
 * Validation of records and config files against the published JSON Schemas (schema/*.schema.json), with every
 * ajv error turned into a plain sentence about one field path ('stereo.form', 'waivers.0.reason').
 */
import { Ajv, type ErrorObject, type ValidateFunction } from 'ajv';
import recordSchema from '../../schema/record.schema.json' with { type: 'json' };
import configSchema from '../../schema/config.schema.json' with { type: 'json' };
import { closestWord } from './closest.js';
import { formSynonym } from './form-words.js';

export interface SchemaProblem {
  /** Dotted field path; '' for the whole document. */
  path: string;
  message: string;
  /** Stable id of the kind of problem (see PROBLEM_CODES). */
  code: string;
}

/** ajv keyword -> our problem id. */
export const PROBLEM_CODES: Record<string, string> = {
  required: 'missing-field',
  additionalProperties: 'unknown-field',
  enum: 'not-allowed-value',
  type: 'wrong-type',
  minimum: 'out-of-range',
  maximum: 'out-of-range',
  exclusiveMinimum: 'out-of-range',
  exclusiveMaximum: 'out-of-range',
  minLength: 'empty-value',
  maxLength: 'too-long',
  pattern: 'spaces-around',
  minItems: 'too-few-items',
  maxItems: 'too-many-items',
  oneOf: 'structure-choice',
};

/** The options the schemas are compiled with (the schema test checks the schemas against the meta-schema). */
export const AJV_OPTIONS = {
  allErrors: true,
  strict: true,
  strictRequired: false,
  allowUnionTypes: true,
  verbose: true,
} as const;

// The schemas are fixed files, checked against the JSON Schema draft-07 meta-schema by test/registry/schema.test.ts;
// not compiling the meta-schema again on every run saves about a quarter of a second.
const ajv = new Ajv({ ...AJV_OPTIONS, validateSchema: false });
let recordValidator: ValidateFunction | null = null;
let configValidator: ValidateFunction | null = null;

export function validateRecordShape(value: unknown): SchemaProblem[] {
  recordValidator ??= ajv.compile(recordSchema);
  return recordValidator(value) ? [] : explain(recordValidator.errors ?? [], value, 'record');
}

export function validateConfigShape(value: unknown): SchemaProblem[] {
  configValidator ??= ajv.compile(configSchema);
  return configValidator(value) ? [] : explain(configValidator.errors ?? [], value, 'config file');
}

/** '/stereo/components/1/smiles' -> 'stereo.components.1.smiles' */
export function pointerToPath(pointer: string): string {
  if (pointer === '') return '';
  return pointer
    .slice(1)
    .split('/')
    .map((s) => s.replace(/~1/g, '/').replace(/~0/g, '~'))
    .join('.');
}

function join(path: string, key: string): string {
  return path === '' ? key : `${path}.${key}`;
}

function at(value: unknown, path: string): unknown {
  if (path === '') return value;
  let cur: unknown = value;
  for (const part of path.split('.')) {
    if (cur === null || typeof cur !== 'object') return undefined;
    cur = (cur as Record<string, unknown>)[part];
  }
  return cur;
}

function kindOf(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'object') return 'a mapping';
  if (typeof v === 'string') return `the text ${quote(v)}`;
  return `${typeof v} ${safeJson(v)}`;
}

function quote(v: unknown): string {
  const s = typeof v === 'string' ? v : safeJson(v);
  const short = s.length > 60 ? `${s.slice(0, 57)}...` : s;
  return `'${short}'`;
}

/** JSON text of any value; never throws (undefined, BigInt, cycles and functions have no JSON). */
function safeJson(v: unknown): string {
  try {
    return JSON.stringify(v) ?? String(v);
  } catch {
    return Object.prototype.toString.call(v);
  }
}

function allowedProperties(schemaNode: unknown): string[] {
  const props = (schemaNode as { properties?: Record<string, unknown> } | undefined)?.properties;
  return props ? Object.keys(props) : [];
}

const TYPE_WORDS: Record<string, string> = {
  string: 'text',
  number: 'a number',
  integer: 'a whole number',
  object: 'a mapping of fields',
  array: 'a list',
  boolean: 'true or false',
};

function explainOne(e: ErrorObject, value: unknown, what: string): Omit<SchemaProblem, 'code'> | null {
  const path = pointerToPath(e.instancePath);
  const label = path === '' ? `the ${what}` : path;
  const got = at(value, path);
  switch (e.keyword) {
    case 'required': {
      const missing = String((e.params as { missingProperty: string }).missingProperty);
      return {
        path: join(path, missing),
        message: `${join(path, missing)}: this field is required but missing`,
      };
    }
    case 'additionalProperties': {
      const extra = String((e.params as { additionalProperty: string }).additionalProperty);
      const allowed = allowedProperties(e.parentSchema);
      const guess = closestWord(extra, allowed);
      const hint = guess
        ? `; did you mean '${guess}'?`
        : allowed.length
          ? ` (allowed: ${allowed.join(', ')})`
          : '';
      return {
        path: join(path, extra),
        message: `${join(path, extra)}: '${extra}' is not a field of ${path === '' ? `a ${what}` : path}${hint}`,
      };
    }
    case 'enum': {
      const allowed = ((e.params as { allowedValues: unknown[] }).allowedValues ?? []).map(String);
      const synonym = typeof got === 'string' ? formSynonym(got) : null;
      const guess =
        synonym !== null && allowed.includes(synonym)
          ? synonym
          : typeof got === 'string'
            ? closestWord(got, allowed)
            : null;
      const hint = guess ? `; did you mean '${guess}'?` : '';
      return { path, message: `${label}: ${quote(got)} is not one of ${allowed.join(', ')}${hint}` };
    }
    case 'type': {
      const want = String((e.params as { type: string }).type)
        .split(',')
        .map((t) => TYPE_WORDS[t] ?? t)
        .join(' or ');
      const props = allowedProperties(e.parentSchema);
      const tip =
        want === 'text' && (typeof got === 'number' || typeof got === 'boolean')
          ? ' (put it in quotes)'
          : want === 'a mapping of fields' && props.includes('smiles') && props.includes('molfile')
            ? ' (write it as smiles: … or molfile: … on the next line, indented)'
            : '';
      return { path, message: `${label}: must be ${want}, found ${kindOf(got)}${tip}` };
    }
    case 'minimum':
    case 'maximum':
    case 'exclusiveMinimum':
    case 'exclusiveMaximum': {
      const limit = (e.params as { limit: number }).limit;
      const words = {
        minimum: 'at least',
        maximum: 'at most',
        exclusiveMinimum: 'more than',
        exclusiveMaximum: 'less than',
      };
      return {
        path,
        message: `${label}: must be ${words[e.keyword]} ${limit}, found ${typeof got === 'number' ? got : kindOf(got)}`,
      };
    }
    case 'minLength':
      return { path, message: `${label}: must not be empty` };
    case 'maxLength':
      return {
        path,
        message: `${label}: is too long (at most ${(e.params as { limit: number }).limit} characters)`,
      };
    case 'pattern':
      return { path, message: `${label}: ${quote(got)} must not start or end with spaces` };
    case 'maxItems': {
      const n = Array.isArray(got) ? got.length : 0;
      const limit = (e.params as { limit: number }).limit;
      // Components are the one list whose length bounds the audit's work: there the record is not audited.
      const advice = /components$/.test(path)
        ? 'the record is not audited (split it into several records)'
        : 'shorten the list';
      return { path, message: `${label}: ${n} items, more than the limit of ${limit}; ${advice}` };
    }
    case 'minItems':
      return {
        path,
        message: `${label}: needs at least ${itemCount((e.params as { limit: number }).limit)}`,
      };
    case 'oneOf': {
      if (got === null || typeof got !== 'object' || Array.isArray(got)) {
        return {
          path,
          message: `${label}: must be a mapping with smiles or molfile (e.g. smiles: CCO), found ${kindOf(got)}`,
        };
      }
      const obj = got as Record<string, unknown>;
      const both = 'smiles' in obj && 'molfile' in obj;
      return {
        path,
        message: `${label}: give exactly one of smiles or molfile (found ${both ? 'both' : 'neither'})`,
      };
    }
    default:
      return { path, message: `${label}: ${e.message ?? 'is not valid'}` };
  }
}

/** Plain problems, one per distinct fault; the sub-errors of a failed oneOf are folded into its own message. */
function explain(errors: ErrorObject[], value: unknown, what: string): SchemaProblem[] {
  const oneOfPaths = errors.filter((e) => e.keyword === 'oneOf').map((e) => e.schemaPath);
  // a value of the wrong type (`structure: CCO`) fails its oneOf too; the type error alone says what is wrong
  const wrongType = new Set(errors.filter((e) => e.keyword === 'type').map((e) => e.instancePath));
  const out: SchemaProblem[] = [];
  const seen = new Set<string>();
  for (const e of errors) {
    if (oneOfPaths.some((p) => e.schemaPath !== p && e.schemaPath.startsWith(`${p}/`))) continue;
    if (e.keyword === 'oneOf' && wrongType.has(e.instancePath)) continue;
    const p = explainOne(e, value, what);
    if (!p || seen.has(p.message)) continue;
    seen.add(p.message);
    out.push({ ...p, code: PROBLEM_CODES[e.keyword] ?? 'schema' });
  }
  return out;
}

const itemCount = (n: number): string => `${n} ${n === 1 ? 'item' : 'items'}`;
