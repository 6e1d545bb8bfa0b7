/**
 * Configured severities set the level of a check's failures: raised and lowered alike; note-level messages stay
 * notes; 'check-id/message-id' sets one message, notes included, and 'off' there drops that message. The real
 * checks and engine are used for the registry duplicate of the issue (a duplicate stayed a warning under
 * `consistent-with-registry: error`).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import { resolveSeverity } from '../../src/audit/findings.js';
import { CHECKS as REAL_CHECKS } from '../../src/checks/index.js';
import { recordYaml as rec, tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { fakeEngine } from './fake-engine.js';
import { formCheck, ratioNote } from './fake-checks.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

describe('resolveSeverity', () => {
  it('a configured level replaces the level of failures, up or down; notes stay notes', () => {
    expect(resolveSeverity('error', 'warning', 'error')).toBe('error'); // raised
    expect(resolveSeverity('error', undefined, 'warning')).toBe('warning'); // lowered
    expect(resolveSeverity('error', 'warning', 'note')).toBe('note'); // lowered to a note
    expect(resolveSeverity('error', 'note', 'error')).toBe('note'); // a note is no failure
    expect(resolveSeverity('error', 'warning', undefined)).toBe('warning'); // nothing configured
  });
  it('a level for one message wins, notes included', () => {
    expect(resolveSeverity('error', 'note', undefined, 'warning')).toBe('warning');
    expect(resolveSeverity('error', 'warning', 'error', 'note')).toBe('note');
  });
});

describe('severities in a run', () => {
  it('raising and lowering a check with fake checks', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'meso', '  ratio: "1:2"\n'),
      'compounds/b.yml': rec('LX-00002', 'meso', '  ratio: "70:30"\n'),
    });
    const levels = async (severities: Record<string, string>) =>
      (
        await runAudit({
          root: reg!.root,
          checks: [formCheck, ratioNote],
          engine: fakeEngine(),
          config: { severities: severities as never },
        })
      ).records.map((r) => r.findings.map((f) => `${f.check}:${f.messageId}:${f.severity}`));
    // defaults: fake-form error, fake-ratio warning with a note-level message
    expect(await levels({})).toEqual([
      ['fake-form:not-achiral:error', 'fake-ratio:bad-ratio:warning'],
      ['fake-form:not-achiral:error', 'fake-ratio:has-ratio:note'],
    ]);
    // raise fake-ratio, lower fake-form
    expect(await levels({ 'fake-ratio': 'error', 'fake-form': 'warning' })).toEqual([
      ['fake-form:not-achiral:warning', 'fake-ratio:bad-ratio:error'],
      ['fake-form:not-achiral:warning', 'fake-ratio:has-ratio:note'],
    ]);
    // one message: the note raised, the other message switched off
    expect(await levels({ 'fake-ratio/has-ratio': 'warning', 'fake-ratio/bad-ratio': 'off' })).toEqual([
      ['fake-form:not-achiral:error'],
      ['fake-form:not-achiral:error', 'fake-ratio:has-ratio:warning'],
    ]);
  });

  it('a message key the check does not have is a usage error', async () => {
    reg = tmpRegistry({
      'stereogate.config.yml': 'severities:\n  fake-ratio/has-ration: warning\n',
      'compounds/a.yml': rec('LX-1', 'achiral'),
    });
    await expect(
      runAudit({ root: reg.root, checks: [formCheck, ratioNote], engine: fakeEngine() }),
    ).rejects.toThrow(/fake-ratio has no message 'has-ration'/);
  });

  // The duplicate of the issue, with the real checks and engine: registering the same enantiomer of
  // butan-2-ol twice is a warning by default; the configured error raises it (exit code follows the level).
  it('consistent-with-registry: error raises a duplicate to an error; warning and note lower it', async () => {
    const files = (config: string) => ({
      'stereogate.config.yml': config,
      'compounds/LX-00001.yml': rec('LX-00001', 'single-enantiomer', '', 'C[C@@H](O)CC'),
      'compounds/LX-00002.yml': rec('LX-00002', 'single-enantiomer', '', 'C[C@@H](O)CC'),
    });
    const duplicate = async (config: string) => {
      reg?.remove();
      reg = tmpRegistry(files(config));
      const r = await runAudit({ root: reg.root, checks: REAL_CHECKS });
      return r.records[1]!.findings.filter((f) => f.messageId === 'already-registered').map(
        (f) => f.severity,
      );
    };
    expect(await duplicate('recordDirs: [compounds]\n')).toEqual(['warning']);
    expect(await duplicate('severities:\n  consistent-with-registry: error\n')).toEqual(['error']);
    expect(await duplicate('severities:\n  consistent-with-registry: note\n')).toEqual(['note']);
    expect(await duplicate('severities:\n  consistent-with-registry/already-registered: error\n')).toEqual([
      'error',
    ]);
  });
});
