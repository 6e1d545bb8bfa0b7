/**
 * Checks that do not apply to a record (no ratio, no rotation, no origin declared) are listed as not applicable,
 * with the reason, by the text report with --verbose, never as passed; the default report and the JSON report
 * leave them out as before.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { recordYaml, tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { memoryIo } from '../cli/io.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

async function audit(...args: string[]): Promise<string> {
  const io = memoryIo();
  await run(['audit', '--root', reg!.root, '--fail-on', 'never', ...args], io);
  return io.stdout.join('\n');
}

describe('checks that do not apply', () => {
  // ethanol: achiral, no stereo unit (handbook fact); the record declares no ratio, ee, rotation or origin
  it('--verbose lists each with its reason, apart from the passed checks', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CCO') });
    const text = await audit('--verbose');
    const lines = text.split('\n');
    for (const want of [
      '  – not applicable ratio-and-ee-consistent: no ratio or ee declared (stereo.ratio, stereo.ee)',
      '  – not applicable rotation-consistent: no rotation given (stereo.rotation)',
      '  – not applicable origin-supports-claim: no origin given (origin)',
      '  – not applicable waiver-review: the record has no waivers',
    ])
      expect(lines).toContain(want);
    const passed = lines.filter((l) => l.startsWith('  ✓')).join('\n');
    expect(passed).toContain('form-matches-structure');
    expect(passed).not.toMatch(
      /ratio-and-ee-consistent|rotation-consistent|origin-supports-claim|waiver-review/,
    );
  });

  it('the default text and the JSON report do not list them', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CCO') });
    expect(await audit()).not.toContain('not applicable');
    const json = JSON.parse(await audit('--format', 'json'));
    expect(Object.keys(json.records[0])).not.toContain('notApplicable');
    expect(JSON.stringify(json)).not.toContain('no rotation given');
  });
});
