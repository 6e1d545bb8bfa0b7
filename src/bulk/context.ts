/** What a bulk worker (or the inline path) needs: engine, checks, config, mapping, and the output renderer. */
import { defaultEngine } from '../audit/engine.js';
import type { AuditConfig } from '../checks/types.js';
import type { Budget } from '../chem/budget.js';
import { itemId, type ItemContext } from './audit-item.js';
import type { BulkItem } from './sources.js';
import { makeVocabulary, type BulkMapping } from './mapping.js';
import { makeRenderer, type Renderer, type RenderWants } from './render-record.js';
import { bulkSarifRules } from './sarif-writer.js';

/** Sent once to every worker (structured-cloneable). */
export interface WorkerSetup {
  mapping: BulkMapping;
  config: AuditConfig;
  wants: RenderWants;
  /** Per-record time and memory limits the worker stops a record at itself (the pool's kill is the backstop). */
  budget?: Budget;
  /** Records of the export that origins name (collectOriginInputs), when an origin column is mapped. */
  originInputs?: BulkItem[];
  /** See ItemContext.registryNotRun. */
  registryNotRun?: string | null;
}

export interface BulkContext extends ItemContext {
  render: Renderer;
}

export async function makeItemContext(setup: WorkerSetup): Promise<BulkContext> {
  const [{ CHECKS }, engine] = await Promise.all([
    import('../checks/index.js'),
    defaultEngine({ axisOrthoMin: setup.config.axisOrthoMin }),
  ]);
  return {
    mapping: setup.mapping,
    vocabulary: makeVocabulary(setup.mapping.vocabulary),
    checks: CHECKS,
    config: setup.config,
    engine,
    budget: setup.budget,
    originInputs: setup.originInputs
      ? new Map(setup.originInputs.map((item) => [itemId(item, setup.mapping), item]))
      : undefined,
    registryNotRun: setup.registryNotRun,
    render: makeRenderer(setup.wants, bulkSarifRules(CHECKS)),
  };
}
