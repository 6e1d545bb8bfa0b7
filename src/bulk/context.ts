/** What a bulk worker (or the inline path) needs to audit items: engine, checks, config, mapping. */
import { defaultEngine } from '../audit/engine.js';
import type { AuditConfig } from '../checks/types.js';
import type { ItemContext } from './audit-item.js';
import { makeVocabulary, type BulkMapping } from './mapping.js';

export interface WorkerSetup {
  mapping: BulkMapping;
  config: AuditConfig;
}

export async function makeItemContext(setup: WorkerSetup): Promise<ItemContext> {
  const [{ CHECKS }, engine] = await Promise.all([import('../checks/index.js'), defaultEngine()]);
  return {
    mapping: setup.mapping,
    vocabulary: makeVocabulary(setup.mapping.vocabulary),
    checks: CHECKS,
    config: setup.config,
    engine,
  };
}
