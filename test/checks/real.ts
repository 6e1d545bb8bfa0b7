/**
 * Check contexts built from real structures through the engine (src/chem), for tests that go through
 * perception, CIP labelling, symmetry and relation rather than hand-made facts.
 */
import { describe as describeStructure, readStructure, relate } from '../../src/chem/index.js';
import type { CheckContext, ReadStructure } from '../../src/checks/types.js';
import type { CompoundRecord } from '../../src/registry/types.js';
import { ctx, loaded } from './facts.js';

export function readSmiles(smiles: string): ReadStructure {
  const r = readStructure(smiles, { format: 'smiles' });
  if (!r.ok)
    return {
      structure: null,
      facts: null,
      error: { message: r.error.message, line: null, offset: r.error.at.offset ?? null },
    };
  return { structure: r.structure, facts: describeStructure(r.structure), error: null };
}

/** A context for `record`, its structure and components read from their SMILES; `others` are registered too. */
export function realCtx(record: CompoundRecord, options: { others?: CompoundRecord[] } = {}): CheckContext {
  const main = readSmiles(record.structure.smiles ?? '');
  const components = (record.stereo.components ?? []).map((c) => readSmiles(c.smiles ?? ''));
  const c = ctx({ record, main, components, loaded: loaded(record, `compounds/${record.id}.yml`) });
  const entries = [record, ...(options.others ?? [])].map((r, i) => ({
    id: r.id,
    file: `compounds/${r.id}.yml`,
    record: r,
    main: i === 0 ? main : readSmiles(r.structure.smiles ?? ''),
    underReview: i === 0,
  }));
  c.registry = { entries };
  c.engine = { relate };
  return c;
}
