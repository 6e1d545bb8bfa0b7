/**
 * A crash never shares an exit code with "findings found" (issue 10): an error thrown out of a command exits 3
 * with an internal-error message; an audit in which stereogate failed on one record still writes the report and
 * exits 3; a bulk run that fails part-way still finishes its outputs with what was computed; an error raised
 * outside any call chain (a timer) also exits 3.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { runBulkAudit } from '../../src/bulk/run.js';
import { jsonWriter, type RecordWriter } from '../../src/bulk/writers.js';
import { EXIT_CRASH, EXIT_USAGE, type Command } from '../../src/cli/command.js';
import { makeAuditCommand } from '../../src/cli/commands/audit.js';
import { commands } from '../../src/cli/commands/index.js';
import { run } from '../../src/cli/main.js';
import { tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { fakeEngine } from '../audit/fake-engine.js';
import { formCheck, throwingCheck } from '../audit/fake-checks.js';
import { memoryIo } from './io.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

describe('exit code 3 for crashes', () => {
  it('is distinct from 0, 1 (findings) and 2 (usage)', () => {
    expect(EXIT_CRASH).toBe(3);
    expect(EXIT_CRASH).not.toBe(EXIT_USAGE);
  });

  it('an error thrown out of a command: exit 3, stderr says internal error', async () => {
    const boom: Command = {
      name: 'boom-test',
      summary: 'test',
      usage: 'test',
      run: () => {
        throw new TypeError("Cannot use 'in' operator");
      },
    };
    commands.push(boom);
    try {
      const io = memoryIo();
      expect(await run(['boom-test'], io)).toBe(EXIT_CRASH);
      expect(io.stderr.join('')).toMatch(/internal error.*exit code 3/);
      expect(io.stderr.join('')).toContain("TypeError: Cannot use 'in' operator");
    } finally {
      commands.splice(commands.indexOf(boom), 1);
    }
  });

  it('a record audit hitting an internal error writes the whole report and exits 3', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': 'id: LX-1\nname: explode\nstructure:\n  smiles: CC\nstereo:\n  form: achiral\n',
      'compounds/b.yml': 'id: LX-2\nstructure:\n  smiles: CC\nstereo:\n  form: meso\n',
    });
    const out = join(reg.root, 'report.json');
    const cmd = makeAuditCommand({ checks: [formCheck, throwingCheck], engine: fakeEngine() });
    const io = memoryIo();
    expect(await cmd.run(['--root', reg.root, '--format', 'json', '--output', out], io)).toBe(EXIT_CRASH);
    const report = JSON.parse(readFileSync(out, 'utf8')) as {
      records: { id: string; findings: { check: string }[] }[];
    };
    expect(report.records.map((r) => r.id)).toEqual(['LX-1', 'LX-2']);
    expect(report.records[0]!.findings.map((f) => f.check)).toContain('internal-error');
    expect(report.records[1]!.findings.map((f) => f.check)).toContain('fake-form');
  });

  it('a bulk run failing part-way still finishes its outputs with the records computed', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'stereogate-crash-'));
    const csv = join(dir, 'in.csv');
    writeFileSync(csv, 'id,smiles\nLX-1,CC\nLX-2,CCO\nLX-3,CCC\n');
    const json = join(dir, 'out.json');
    let n = 0;
    const failing: RecordWriter = {
      write: async () => {
        if (++n === 3) throw new Error('disk full');
      },
      finish: async () => undefined,
    };
    await expect(
      runBulkAudit({
        inputs: [csv],
        mapping: {},
        config: { ...DEFAULT_CONFIG },
        workers: 0,
        progress: 'none',
        writers: [jsonWriter(json), failing],
      }),
    ).rejects.toThrow('disk full');
    const written = JSON.parse(readFileSync(json, 'utf8')) as { records: { id: string }[]; summary: object };
    expect(written.records.map((r) => r.id)).toEqual(['LX-1', 'LX-2', 'LX-3']);
    expect(written.summary).toBeDefined();
  });

  it('an error outside any call chain (a timer) exits 3, not 1', () => {
    const main = new URL('../../src/cli/main.ts', import.meta.url).pathname;
    const code = `import { installCrashHandlers } from ${JSON.stringify(main)}; installCrashHandlers(); setTimeout(() => { throw new Error('late'); }, 1);`;
    const r = spawnSync(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', code], {
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(r.stderr).toContain('internal error');
    expect(r.status).toBe(EXIT_CRASH);
  });
});
