/**
 * The registry-wide phase of a bulk run, in the main thread as the ordered results stream past (and in `merge`,
 * over the records of every shard in input order, so a split run merged gets exactly the findings of one run).
 * Each record's keys (registry_row, made in the worker) are compared with the records before it in the index
 * and then filed; a record that gets a finding is rendered again from its JSON, every other one passes through
 * untouched. Duplicates and enantiomer pairs are listed once in the summary.
 */
import { defaultEngine } from '../audit/engine.js';
import { RegistryPhase, notRunSummary } from '../audit/registry-phase.js';
import { addPhaseResult, confirmWith } from '../audit/run.js';
import type { RegistrySummary } from '../audit/types.js';
import type { AuditConfig, CheckModule } from '../checks/types.js';
import type { BulkRecordResult } from './audit-item.js';
import { JSONL_PREFIX, type RenderedRecord, type Renderer } from './render-record.js';

/** Why a shard's records carry the registry-wide checks as not run. */
export function shardNotRun(shard: { index: number; count: number }): string {
  return (
    `one shard (${shard.index}/${shard.count}) of a split run holds only part of the records: the registry-wide ` +
    'checks (duplicates, enantiomer pairs) run when the shard outputs are merged (stereogate merge)'
  );
}

function isShardNotRun(reason: string): boolean {
  return /^one shard \(\d+\/\d+\) of a split run/.test(reason);
}

export class BulkRegistryPhase {
  private readonly wide: Set<string>;

  private constructor(
    private readonly phase: RegistryPhase,
    private readonly render: Renderer,
    checks: readonly CheckModule[],
  ) {
    this.wide = new Set(checks.filter((c) => c.scope === 'registry').map((c) => c.id));
  }

  static async create(
    config: AuditConfig,
    render: Renderer,
    checks: readonly CheckModule[],
  ): Promise<BulkRegistryPhase> {
    const engine = await defaultEngine({ axisOrthoMin: config.axisOrthoMin });
    const phase = new RegistryPhase({ mode: 'full', config, confirm: confirmWith(engine) });
    return new BulkRegistryPhase(phase, render, checks);
  }

  /** A record rendered in a worker (its JSON Lines text made, see runBulkAudit). */
  rendered(r: RenderedRecord): RenderedRecord {
    if (!r.row) return r;
    const found = this.phase.next(r.row);
    if (found.findings.length === 0) return r;
    const result = JSON.parse('{' + r.jsonl.slice(JSONL_PREFIX.length)) as BulkRecordResult;
    addPhaseResult(result, { findings: found.findings, passed: null });
    return this.render(result);
  }

  /** A record read back from a shard output: the shard's "not run" for the registry-wide checks is now run. */
  result(r: BulkRecordResult): RenderedRecord {
    if (r.notRun) r.notRun = r.notRun.filter((n) => !(this.wide.has(n.check) && isShardNotRun(n.reason)));
    if (r.registry_row) {
      const found = this.phase.next(r.registry_row);
      addPhaseResult(r, { findings: found.findings, passed: null });
    }
    return this.render(r);
  }

  summary(): RegistrySummary {
    return this.phase.summary();
  }
}

export { notRunSummary };
