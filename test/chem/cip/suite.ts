/**
 * Scoring harness for the CIP validation suite (Hanson et al., J. Chem. Inf. Model. 2018, 58, 1755-1765;
 * data in ../shared/data/cip-validation-suite, see its SOURCE.md): a record is right when the computed labels,
 * written `<atom number><descriptor>`, are exactly the expected ones, no more and no fewer.
 */
import { readFileSync } from 'node:fs';
import { assignCip, findHelices } from '../../../src/chem/cip/index.js';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import { readSdRecords } from '../../../src/chem/read/sdf.js';
import type { Structure } from '../../../src/chem/types.js';
import { sharedDataPath } from '../../support/shared-data.js';

export interface SuiteRecord {
  id: string;
  expected: string[];
  structure: Structure | null;
  error?: string;
}

export interface RecordScore {
  id: string;
  ok: boolean;
  expected: string[];
  computed: string[];
}

export function computedLabels(s: Structure): string[] {
  const out: string[] = [];
  for (const r of assignCip(s)) {
    if (r.label === null) continue;
    for (const a of r.atoms) out.push(`${s.atoms[a].inputNumber}${r.label}`);
  }
  for (const h of findHelices(s)) for (const a of h.atoms) out.push(`${s.atoms[a].inputNumber}${h.label}`);
  return [...new Set(out)].sort(byAtom);
}

function byAtom(a: string, b: string): number {
  return parseInt(a, 10) - parseInt(b, 10) || a.localeCompare(b);
}

function split(labels: string | undefined): string[] {
  return (labels ?? '')
    .trim()
    .split(/\s+/)
    .filter((x) => x.length > 0)
    .sort(byAtom);
}

/** The SMILES of one suite record (compounds.smi), by its id. */
export function suiteSmiles(id: string): string {
  const text = readFileSync(sharedDataPath('cip-validation-suite', 'compounds.smi'), 'utf8');
  for (const line of text.split('\n')) {
    const f = line.split('\t');
    if (f[1] === id) return f[0];
  }
  throw new Error(`${id} missing from compounds.smi`);
}

export function loadSmiles(): SuiteRecord[] {
  const text = readFileSync(sharedDataPath('cip-validation-suite', 'compounds.smi'), 'utf8');
  return text
    .split('\n')
    .filter((l) => l.trim().length > 0)
    .map((line) => {
      const f = line.split('\t');
      const r = parseSmiles(f[0]);
      return r.ok
        ? { id: f[1], expected: split(f[2]), structure: r.structure }
        : { id: f[1], expected: split(f[2]), structure: null, error: r.error.message };
    });
}

export function loadSdf(name: 'compounds_2d.sdf' | 'compounds_3d.sdf'): SuiteRecord[] {
  const text = readFileSync(sharedDataPath('cip-validation-suite', name), 'utf8');
  const out: SuiteRecord[] = [];
  for (const rec of readSdRecords(text)) {
    if (!rec.result.ok) {
      out.push({
        id: `record ${rec.record}`,
        expected: [],
        structure: null,
        error: rec.result.error.message,
      });
      continue;
    }
    const s = rec.result.structure;
    out.push({
      id: s.properties['STRUCTURE_ID'] ?? s.title ?? `record ${rec.record}`,
      expected: split(s.properties['CIP_LABELS']),
      structure: s,
    });
  }
  return out;
}

export function score(records: SuiteRecord[]): RecordScore[] {
  return records.map((r) => {
    const computed = r.structure ? computedLabels(r.structure) : [`(unread: ${r.error})`];
    const ok = computed.length === r.expected.length && computed.every((c, i) => c === r.expected[i]);
    return { id: r.id, ok, expected: r.expected, computed };
  });
}

export function report(scores: RecordScore[]): string {
  return scores
    .filter((s) => !s.ok)
    .map((s) => `${s.id}: expected [${s.expected.join(' ')}] computed [${s.computed.join(' ')}]`)
    .join('\n');
}
