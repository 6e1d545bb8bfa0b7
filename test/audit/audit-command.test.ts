/**
 * `stereogate audit`: exit codes (0 / 1 by --fail-on, waived findings never count, 2 for usage errors), formats
 * and --output. Uses the fake checks and engine so that it tests the command, not the chemistry.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { makeAuditCommand } from '../../src/cli/commands/audit.js';
import { run } from '../../src/cli/main.js';
import { UsageError, type Io } from '../../src/cli/command.js';
import { tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { fakeEngine } from './fake-engine.js';
import { formCheck, ratioNote } from './fake-checks.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

function io() {
  const out: string[] = [];
  const err: string[] = [];
  const x: Io = {
    out: (t) => out.push(t),
    err: (t) => err.push(t),
    readFile: (p) => readFileSync(p, 'utf8'),
    isFile: () => false,
    readStdin: () => '',
  };
  return { io: x, out, err };
}

const rec = (id: string, form: string, extra = '') =>
  `id: ${id}\nstructure:\n  smiles: CC\nstereo:\n  form: ${form}\n${extra}`;
const command = () => makeAuditCommand({ checks: [formCheck, ratioNote], engine: fakeEngine() });

describe('stereogate audit exit codes', () => {
  it('0 when clean, 1 when an error finding is open', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': rec('LX-1', 'achiral'), 'compounds/b.yml': rec('LX-2', 'meso') });
    const t = io();
    expect(await command().run(['--root', reg.root, 'compounds/a.yml'], t.io)).toBe(0);
    expect(t.out.join('')).toMatch(/✓ LX-1 {2}1 check passed/);
    expect(await command().run(['--root', reg.root], io().io)).toBe(1);
    expect(await command().run(['--root', reg.root, '--fail-on', 'never'], io().io)).toBe(0);
  });

  it('--fail-on warning counts warnings; notes never fail', async () => {
    reg = tmpRegistry({
      'compounds/w.yml': rec('LX-1', 'achiral', '  ratio: "1:2"\n'),
      'compounds/n.yml': rec('LX-2', 'achiral', '  ratio: "70:30"\n'),
    });
    expect(await command().run(['--root', reg.root, 'compounds/w.yml'], io().io)).toBe(0);
    expect(
      await command().run(['--root', reg.root, '--fail-on', 'warning', 'compounds/w.yml'], io().io),
    ).toBe(1);
    expect(
      await command().run(['--root', reg.root, '--fail-on', 'warning', 'compounds/n.yml'], io().io),
    ).toBe(0);
  });

  it('waived findings never count', async () => {
    const waiver =
      'waivers:\n  - check: fake-form\n    reason: assigned by X-ray\n    approved_by: Dr. Vale\n';
    reg = tmpRegistry({ 'compounds/a.yml': rec('LX-1', 'meso', waiver) });
    expect(await command().run(['--root', reg.root, '--fail-on', 'warning'], io().io)).toBe(0);
  });

  it('usage errors: bad option values, unknown paths, config problems, missing root', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-1', 'achiral'),
      'bad.yml': 'severities:\n  fake-form: loud\n',
    });
    const root = reg.root;
    await expect(command().run(['--root', root, '--format', 'pdf'], io().io)).rejects.toThrow(
      /--format must be one of text, json, markdown, sarif/,
    );
    await expect(command().run(['--root', root, '--fail-on', 'notes'], io().io)).rejects.toBeInstanceOf(
      UsageError,
    );
    await expect(command().run(['--root', root, '--colour'], io().io)).rejects.toBeInstanceOf(UsageError);
    await expect(command().run(['--root', root, 'compounds/zz.yml'], io().io)).rejects.toThrow(
      /matches: compounds\/zz\.yml/,
    );
    await expect(command().run(['--root', root, '--config', join(root, 'bad.yml')], io().io)).rejects.toThrow(
      /fake-form: 'loud' is not one of error, warning, note, off/,
    );
    await expect(command().run(['--root', join(root, 'nope')], io().io)).rejects.toThrow(/does not exist/);
  });
});

describe('stereogate audit output', () => {
  it('writes each format, to standard output or --output', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': rec('LX-1', 'meso') });
    const t = io();
    await command().run(['--root', reg.root, '--format', 'json'], t.io);
    const json = JSON.parse(t.out.join(''));
    expect(json.records[0].findings[0]).toMatchObject({ check: 'fake-form', severity: 'error', line: 5 });
    const outFile = join(reg.root, 'report.sarif');
    const t2 = io();
    await command().run(['--root', reg.root, '--format', 'sarif', '--output', outFile], t2.io);
    expect(t2.out).toEqual([]);
    const sarif = JSON.parse(readFileSync(outFile, 'utf8'));
    expect(sarif.version).toBe('2.1.0');
    expect(sarif.runs[0].tool.driver.rules.map((r: { id: string }) => r.id)).toContain('fake-form');
    const t3 = io();
    await command().run(['--root', reg.root, '--format', 'markdown'], t3.io);
    expect(t3.out.join('')).toMatch(/^<!-- stereogate-checklist -->/);
  });

  it('takes a path relative to the working folder when it exists there', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': rec('LX-1', 'achiral'), 'compounds/b.yml': rec('LX-2', 'meso') });
    const t = io();
    const code = await command().run(
      ['--root', reg.root, '--format', 'json', join(reg.root, 'compounds/a.yml')],
      t.io,
    );
    expect(code).toBe(0);
    expect(JSON.parse(t.out.join('')).records.map((r: { id: string }) => r.id)).toEqual(['LX-1']);
  });
});

describe('stereogate audit through the CLI entry (real engine and checks)', () => {
  it('exit 2 with a message for usage errors, 1 for an error finding, 0 with --fail-on never', async () => {
    // meso-tartaric acid is achiral (IUPAC Gold Book, "meso-compound"), so "racemate" is an error
    reg = tmpRegistry({
      'compounds/a.yml':
        'id: LX-00002\nstructure:\n  smiles: "OC(=O)[C@@H](O)[C@@H](O)C(=O)O"\nstereo:\n  form: racemate\n',
    });
    const t = io();
    expect(await run(['audit', '--root', reg.root, '--fail-on', 'sometimes'], t.io)).toBe(2);
    expect(t.err.join('')).toContain('--fail-on must be one of error, warning, never');
    const t2 = io();
    expect(await run(['audit', '--root', reg.root], t2.io)).toBe(1);
    expect(t2.out.join('')).toMatch(/✗ error +form-matches-structure line 5/);
    expect(await run(['audit', '--root', reg.root, '--fail-on', 'never'], io().io)).toBe(0);
  });
});
