/**
 * Checks that could not run are in the SARIF log as tool execution notifications of the run's invocation (SARIF
 * 2.1.0, 3.20.21: runtime conditions met during the analysis; 3.58.7 associatedRule names the check), with the
 * records' locations; they are never results. The record audit's log and the bulk audit's streamed log alike.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { recordYaml, tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { memoryIo } from '../cli/io.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

interface Notification {
  level: string;
  message: { text: string };
  associatedRule: { id: string; index?: number };
  locations: { physicalLocation: { artifactLocation: { uri: string }; region?: { startLine: number } } }[];
}
interface SarifRun {
  tool: { driver: { rules: { id: string }[] } };
  invocations?: { executionSuccessful: boolean; toolExecutionNotifications: Notification[] }[];
  results: { ruleId: string }[];
}

const READ = 'the structure could not be read (see structure-readable)';

describe('not-run checks in SARIF', () => {
  it('the record audit: one notification per check, naming the record and its file, tied to the rule', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CC1CC(C'), // ring never closed
      'compounds/b.yml': recordYaml('LX-00002', 'achiral', '', 'CCO'),
    });
    const io = memoryIo();
    await run(['audit', '--root', reg.root, '--fail-on', 'never', '--format', 'sarif'], io);
    const log = JSON.parse(io.stdout.join('\n')) as { runs: SarifRun[] };
    const [r] = log.runs;
    const notes = r!.invocations![0]!.toolExecutionNotifications;
    expect(r!.invocations![0]!.executionSuccessful).toBe(true);
    const form = notes.find((n) => n.associatedRule.id === 'form-matches-structure')!;
    expect(form.message.text).toBe(`form-matches-structure did not run on 1 record (LX-00001): ${READ}.`);
    expect(form.level).toBe('note');
    expect(form.locations.map((l) => l.physicalLocation.artifactLocation.uri)).toEqual(['compounds/a.yml']);
    expect(r!.tool.driver.rules[form.associatedRule.index!]!.id).toBe('form-matches-structure');
    // not results: the record's only results are its findings
    expect(r!.results.map((x) => x.ruleId)).toEqual(['structure-readable']);
  });

  it('a run where every check ran has no invocation notifications', async () => {
    reg = tmpRegistry({ 'compounds/b.yml': recordYaml('LX-00002', 'achiral', '', 'CCO') });
    const io = memoryIo();
    await run(['audit', '--root', reg.root, '--fail-on', 'never', '--format', 'sarif'], io);
    expect((JSON.parse(io.stdout.join('\n')) as { runs: SarifRun[] }).runs[0]!.invocations).toBeUndefined();
  });

  it('the bulk audit: the streamed log carries them too, with the record line in the export', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sg-notrun-'));
    const csv = join(dir, 'export.csv');
    writeFileSync(
      csv,
      'id,smiles,form\nLX-00001,CCO,achiral\nLX-00002,CC1CC(C,achiral\nLX-00003,CC1CC(,achiral\n',
    );
    const sarif = join(dir, 'out.sarif');
    const io = memoryIo();
    await run(['audit', csv, '--progress', 'none', '--workers', '1', '--sarif', sarif], io);
    const log = JSON.parse(readFileSync(sarif, 'utf8')) as { runs: SarifRun[] };
    const notes = log.runs[0]!.invocations![0]!.toolExecutionNotifications;
    const form = notes.find((n) => n.associatedRule.id === 'form-matches-structure')!;
    expect(form.message.text).toBe(
      `form-matches-structure did not run on 2 records (LX-00002, LX-00003): ${READ}.`,
    );
    expect(form.locations.map((l) => l.physicalLocation.region?.startLine)).toEqual([3, 4]);
  });
});
