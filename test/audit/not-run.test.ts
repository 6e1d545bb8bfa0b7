/**
 * A check that did not run is reported as not run, with the reason — never as passed (issue 12): a structure that
 * cannot be read leaves the structure checks without input; a bulk run (each record on its own) leaves the
 * registry check without the registry. Failing case (before: listed as passed, or silently left out) beside the
 * passing case (the same record with its input, which runs and passes).
 */
import { describe, expect, it } from 'vitest';
import { auditRecords } from '../../src/audit/run.js';
import { defaultEngine } from '../../src/audit/engine.js';
import { CHECKS } from '../../src/checks/index.js';
import { BULK_REGISTRY_NOT_COMPARED } from '../../src/bulk/audit-item.js';
import { renderText } from '../../src/report/text.js';
import { renderMarkdown } from '../../src/report/markdown.js';
import { jsonReport } from '../../src/report/json.js';
import { loaded, record } from '../checks/facts.js';

const engine = await defaultEngine();
const butanol = (smiles: string) =>
  loaded(
    record({ form: 'single-enantiomer', descriptors: '(R)' }, { id: 'LX-00050', structure: { smiles } }),
  );

describe('checks that did not run', () => {
  it('an unreadable structure: the structure checks are not run, with the reason, and never passed', () => {
    const bad = auditRecords([butanol('C[C@@H](O)C(')], { checks: CHECKS, engine }).records[0]!;
    const notRun = (bad.notRun ?? []).map((n) => n.check);
    for (const id of [
      'form-matches-structure',
      'enhanced-stereo-matches-form',
      'descriptors-match-structure',
      'nitrogen-inversion',
      'consistent-with-registry',
    ]) {
      expect([id, notRun.includes(id)]).toEqual([id, true]);
      expect([id, bad.passed.some((p) => p.check === id)]).toEqual([id, false]);
    }
    expect(bad.notRun![0]!.reason).toBe('the structure could not be read (see structure-readable)');
    expect(bad.findings.map((f) => f.check)).toEqual(['structure-readable']);
    // the same record with a readable structure: those checks run and pass
    const good = auditRecords([butanol('C[C@@H](O)CC')], { checks: CHECKS, engine }).records[0]!;
    expect(good.notRun).toEqual([]);
    expect(good.passed.map((p) => p.check)).toContain('descriptors-match-structure');
  });

  it('a bulk run (each record on its own): the registry check is not run (before: passed, "no other record")', () => {
    const alone = auditRecords([butanol('C[C@@H](O)CC')], {
      checks: CHECKS,
      engine,
      registryIncomplete: BULK_REGISTRY_NOT_COMPARED,
    });
    const r = alone.records[0]!;
    expect(r.notRun).toEqual([{ check: 'consistent-with-registry', reason: BULK_REGISTRY_NOT_COMPARED }]);
    expect(r.passed.map((p) => p.check)).not.toContain('consistent-with-registry');
    // what a person sees
    expect(renderText(alone)).toContain(`not run: consistent-with-registry (${BULK_REGISTRY_NOT_COMPARED})`);
    expect(renderText(alone, { verbose: true })).toContain(
      `– not run consistent-with-registry: ${BULK_REGISTRY_NOT_COMPARED}`,
    );
    expect(renderMarkdown(alone)).toContain('- not run: `consistent-with-registry`: a bulk audit checks');
    expect((jsonReport(alone).records as { notRun: unknown[] }[])[0]!.notRun).toHaveLength(1);
    // with the whole registry at hand it runs
    const whole = auditRecords([butanol('C[C@@H](O)CC')], { checks: CHECKS, engine }).records[0]!;
    expect(whole.passed.map((p) => p.check)).toContain('consistent-with-registry');
  });
});
