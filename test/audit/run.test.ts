/**
 * The audit pipeline with fake checks and a fake engine: lines from positions, severity overrides, waivers,
 * a check that throws, selection by path, config files. No chemistry here (see test/checks for that).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { runAudit, auditRecords } from '../../src/audit/run.js';
import { ConfigError } from '../../src/audit/config.js';
import { CAUTION } from '../../src/audit/caution.js';
import type { LoadedRecord } from '../../src/registry/types.js';
import { NO_POSITIONS } from '../../src/registry/positions.js';
import { recordYaml as rec, tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { fakeEngine } from './fake-engine.js';
import { formCheck, ratioNote, spyCheck, throwingCheck } from './fake-checks.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const CHECKS = [formCheck, ratioNote, throwingCheck];

describe('runAudit', () => {
  it('runs every check on every record, lines from the record positions, summary counts', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'achiral'),
      'compounds/b.yml': rec('LX-00002', 'meso', '  ratio: "1:2"\n'),
    });
    const result = await runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() });
    expect(result.records.map((r) => r.id)).toEqual(['LX-00001', 'LX-00002']);
    const [a, b] = result.records;
    expect(a!.findings).toEqual([]);
    expect(a!.passed.map((p) => p.check)).toEqual(['fake-form', 'fake-throws']); // fake-ratio not applicable
    expect(a!.passed[0]!.evidence).toBe('form is achiral');
    expect(b!.findings.map((f) => [f.check, f.severity, f.line, f.message])).toEqual([
      ['fake-form', 'error', 5, 'Declared meso, computed achiral.'],
      ['fake-ratio', 'warning', 6, 'Ratio 1:2 is odd.'],
    ]);
    expect(b!.declared).toEqual({ form: 'meso', descriptors: null });
    expect(b!.computed?.constitutionKey).toBe('CC');
    expect(result.summary).toEqual({ records: 2, errors: 1, warnings: 1, notes: 0, waived: 0 });
    expect(result.caution).toBe(CAUTION);
    expect(result.tool.name).toBe('stereogate');
  });

  it('a check that throws becomes an internal-error finding naming the check; other records are still audited', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': `name: explode\n${rec('LX-00001', 'meso')}`,
      'compounds/b.yml': rec('LX-00002', 'meso'),
    });
    const result = await runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() });
    const a = result.records[0]!;
    const internal = a.findings.find((f) => f.check === 'internal-error');
    expect(internal?.severity).toBe('error');
    expect(internal?.data.check).toBe('fake-throws');
    expect(internal?.message).toContain('fake-throws');
    expect(a.findings.some((f) => f.check === 'fake-form')).toBe(true);
    expect(result.records[1]!.passed.map((p) => p.check)).toContain('fake-throws');
  });

  it('a record that fails the schema appears with record-schema findings at their lines', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': rec('LX-00001', 'racemic') });
    const result = await runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() });
    const f = result.records[0]!.findings.filter((x) => x.check === 'record-schema');
    expect(f).toHaveLength(1);
    expect(f[0]).toMatchObject({
      severity: 'error',
      line: 5,
      field: 'stereo.form',
      messageId: 'not-allowed-value',
    });
    expect(result.records[0]!.declared.form).toBeNull();
  });

  it('a file that does not parse gets only its record-schema finding, no check runs on it', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': 'id: LX-1\nstereo:\n  form: [achiral\n',
      'compounds/b.yml': '- a list\n',
    });
    const result = await runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() });
    for (const r of result.records) {
      expect(r.findings.map((f) => f.check)).toEqual(['record-schema']);
      expect(r.passed).toEqual([]);
    }
    expect(result.records.map((r) => r.findings[0]!.messageId)).toEqual(['yaml-syntax', 'wrong-type']);
  });

  it('complete waivers accept findings of their check; incomplete ones do not', async () => {
    const waivers = (reason: string) =>
      `waivers:\n  - check: fake-form\n    reason: "${reason}"\n    approved_by: Dr. A. Larkspur\n`;
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'meso', waivers('confirmed by X-ray')),
      'compounds/b.yml': rec('LX-00002', 'meso', waivers('')),
    });
    const result = await runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() });
    expect(result.records[0]!.findings[0]!.waived).toEqual({
      reason: 'confirmed by X-ray',
      approvedBy: 'Dr. A. Larkspur',
      covers: 'every finding of fake-form',
    });
    expect(result.records[1]!.findings[0]!.waived).toBeNull();
    expect(result.summary).toMatchObject({ errors: 1, waived: 1 });
  });

  it('severity overrides from the config file; off skips the check; a note-level message stays a note', async () => {
    reg = tmpRegistry({
      'stereogate.config.yml': 'severities:\n  fake-form: "off"\n  fake-ratio: note\n',
      'compounds/a.yml': rec('LX-00001', 'meso', '  ratio: "1:2"\n'),
      'compounds/b.yml': rec('LX-00002', 'meso', '  ratio: "70:30"\n'),
    });
    const r1 = await runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() });
    expect(r1.records[0]!.findings.map((f) => [f.check, f.severity])).toEqual([['fake-ratio', 'note']]);
    expect(r1.records[0]!.passed.map((p) => p.check)).toEqual(['fake-throws']);
    const r2 = await runAudit({
      root: reg.root,
      checks: CHECKS,
      engine: fakeEngine(),
      config: { severities: { 'fake-ratio': 'error' } },
    });
    // fake-form stays off (config file); 'error' replaces fake-ratio's default but a note-level message stays a note
    expect(r2.records.map((r) => r.findings.map((f) => f.severity))).toEqual([['error'], ['note']]);
  });

  it('an unknown check id in severities is a usage error with a suggestion', async () => {
    reg = tmpRegistry({
      'stereogate.config.yml': 'severities:\n  fake-fom: warning\n',
      'compounds/a.yml': rec('LX-1', 'achiral'),
    });
    await expect(runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() })).rejects.toThrow(
      /did you mean 'fake-form'/,
    );
  });

  it('an invalid config file is a ConfigError naming the line', async () => {
    reg = tmpRegistry({
      'stereogate.config.yml': 'recordDirs: [compounds]\neeTolerance: lots\n',
      'compounds/a.yml': rec('LX-1', 'achiral'),
    });
    const p = runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() });
    await expect(p).rejects.toBeInstanceOf(ConfigError);
    await expect(p).rejects.toThrow(/line 2: eeTolerance: must be a number/);
  });

  it('recordDirs from a JSON config; a missing record folder is a ConfigError', async () => {
    reg = tmpRegistry({
      'stereogate.config.json': '{"recordDirs": ["reg"]}',
      'reg/a.yml': rec('LX-1', 'achiral'),
    });
    const r = await runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine() });
    expect(r.records.map((x) => x.file)).toEqual(['reg/a.yml']);
    await expect(
      runAudit({ root: reg.root, checks: CHECKS, engine: fakeEngine(), config: { recordDirs: ['nope'] } }),
    ).rejects.toThrow(/'nope' not found/);
  });

  it('paths select records (file, folder, or a molfile they use); the registry still holds all records', async () => {
    const seen: { id: string | null; priorChecks: string[]; sameKey: number }[] = [];
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'meso', '', 'C[C@H](O)N'),
      'compounds/b.yml': rec('LX-00002', 'meso', '', 'C[C@@H](O)N'),
      'compounds/sub/c.yml': 'id: LX-00003\nstructure:\n  molfile: c.mol\nstereo:\n  form: achiral\n',
      'compounds/sub/c.mol': 'CCO',
    });
    const checks = [formCheck, spyCheck(seen)];
    const byFile = await runAudit({
      root: reg.root,
      paths: ['compounds/a.yml'],
      checks,
      engine: fakeEngine(),
    });
    expect(byFile.records.map((r) => r.id)).toEqual(['LX-00001']);
    expect(seen).toEqual([{ id: 'LX-00001', priorChecks: ['fake-form'], sameKey: 1 }]);
    const byMol = await runAudit({
      root: reg.root,
      paths: ['compounds/sub/c.mol'],
      checks,
      engine: fakeEngine(),
    });
    expect(byMol.records.map((r) => r.id)).toEqual(['LX-00003']);
    const byDir = await runAudit({
      root: reg.root,
      paths: ['compounds/sub/', 'README.md'],
      checks,
      engine: fakeEngine(),
    });
    expect(byDir.records.map((r) => r.id)).toEqual(['LX-00003']);
    expect(byDir.unmatched).toEqual(['README.md']);
  });

  it('describes each structure once even when cross-record lookups touch every record', async () => {
    const seen: { id: string | null; priorChecks: string[]; sameKey: number }[] = [];
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'achiral', '', 'AAA'),
      'compounds/b.yml': rec('LX-00002', 'achiral', '', 'BBB'),
      'compounds/c.yml': rec('LX-00003', 'achiral', '', 'CCC'),
    });
    const engine = fakeEngine();
    await runAudit({ root: reg.root, checks: [spyCheck(seen), spyCheck(seen)], engine });
    expect([...engine.describeCalls].sort()).toEqual(['AAA', 'BBB', 'CCC']);
    expect(seen.map((s) => s.sameKey)).toEqual([1, 1, 1, 1, 1, 1]);
  });

  it('an engine failure while describing becomes a structure error, not a crash', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'achiral', '', 'BOOM'),
      'compounds/b.yml': rec('LX-2', 'achiral', '', 'C!C'),
    });
    let errors: (string | undefined)[] = [];
    const probe = {
      ...formCheck,
      id: 'probe',
      run: (ctx: Parameters<typeof formCheck.run>[0]) => {
        errors.push(ctx.main.error?.message);
        return { findings: [] };
      },
    };
    errors = [];
    const r = await runAudit({ root: reg.root, checks: [probe], engine: fakeEngine() });
    expect(r.records[0]!.computed).toBeNull();
    expect(errors[0]).toContain('internal error while describing');
    expect(errors[1]).toContain('SMILES: bad character');
  });

  it('a missing registry folder is a ConfigError', async () => {
    await expect(
      runAudit({ root: '/nonexistent/stereogate', checks: CHECKS, engine: fakeEngine() }),
    ).rejects.toBeInstanceOf(ConfigError);
  });
});

describe('auditRecords (records that did not come from files)', () => {
  it('bulk records without positions take the line of their row', () => {
    const loaded: LoadedRecord = {
      file: 'legacy.csv',
      id: 'OLD-7',
      record: { id: 'OLD-7', structure: { smiles: 'CC' }, stereo: { form: 'meso' } },
      positions: NO_POSITIONS,
      problems: [],
      origin: { kind: 'bulk', source: 'legacy.csv', record: 7, line: 8 },
    };
    const result = auditRecords([loaded], { checks: [formCheck], engine: fakeEngine() });
    expect(result.records[0]!.findings[0]).toMatchObject({ check: 'fake-form', line: 8 });
    expect(result.records[0]!.computed?.constitutionKey).toBe('CC');
  });
});
