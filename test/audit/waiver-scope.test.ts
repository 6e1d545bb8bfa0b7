/**
 * Waivers that name what they accept: a waiver of consistent-with-registry narrowed by message_id and
 * other_record accepts that finding only, and the report shows what each waiver covers. A waiver naming only
 * the check still accepts every finding of it (records written before the narrowing stay valid), and the report
 * says so; a narrowed waiver that matches nothing is a note. Real audits of a small registry, read as a person
 * reads them (text, Markdown, JSON, SARIF).
 * Chemistry: (R)- and (S)-butan-2-ol are enantiomers; enantiomers measured alike rotate plane-polarised light
 * equally in opposite senses (IUPAC Gold Book, optical activity), so equal signs are a finding.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { memoryIo } from '../cli/io.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const ROTATION = '  rotation: { value: -13.5, wavelength_nm: 589, temperature_c: 20, solvent: neat }\n';
const record = (id: string, smiles: string, rotation: string, waivers = ''): string =>
  `id: ${id}\nstructure:\n  smiles: "${smiles}"\nstereo:\n  form: single-enantiomer\n${rotation}${waivers}`;
const R = 'C[C@@H](O)CC';
const S = 'C[C@H](O)CC';

/**
 * LX-00003, (S), has two findings of consistent-with-registry: identical to LX-00002 (S, registered before it),
 * and the same rotation sign as its enantiomer LX-00001.
 */
function registry(waivers: string): TmpRegistry {
  return tmpRegistry({
    'compounds/a.yml': record('LX-00001', R, ROTATION),
    'compounds/b.yml': record('LX-00002', S, ''),
    'compounds/c.yml': record('LX-00003', S, ROTATION, waivers),
  });
}

async function audit(format: string): Promise<string> {
  const io = memoryIo();
  await run(['audit', '--root', reg!.root, '--fail-on', 'never', '--format', format], io);
  return io.stdout.join('\n');
}

const NARROW =
  'waivers:\n' +
  '  - check: consistent-with-registry\n' +
  '    message_id: enantiomer-rotation-same-sign\n' +
  '    other_record: LX-00001\n' +
  '    reason: rotation of LX-00001 being measured again\n' +
  '    approved_by: J. Okafor\n';

describe('waivers that name what they accept', () => {
  it('a waiver for the rotation finding about LX-00001 leaves the duplicate of LX-00002 open', async () => {
    reg = registry(NARROW);
    const text = await audit('text');
    expect(text).toMatch(
      /✗ warning consistent-with-registry line \d+: This structure is identical to LX-00002/,
    );
    expect(text).toMatch(
      /~ accepted consistent-with-registry line \d+: This compound and its enantiomer LX-00001 have rotations of the same sign/,
    );
    expect(text).toContain(
      'the waiver covers consistent-with-registry (message enantiomer-rotation-same-sign, about LX-00001))',
    );
    expect(text).toContain('3 records audited: 0 errors, 1 warning, 0 notes, 1 accepted by waiver');
    const md = await audit('markdown');
    expect(md).toContain('- [ ] ⚠️ **warning** `consistent-with-registry`');
    expect(md).toContain(
      'Reason: rotation of LX-00001 being measured again · approved by J. Okafor · the waiver covers ' +
        'consistent-with-registry (message enantiomer-rotation-same-sign, about LX-00001)',
    );
  });

  it('a waiver naming only the check accepts both, and the report says it covers every finding of the check', async () => {
    reg = registry(
      'waivers:\n  - check: consistent-with-registry\n    reason: two batches\n    approved_by: J. Okafor\n',
    );
    const text = await audit('text');
    expect(text).toContain('3 records audited: 0 errors, 0 warnings, 0 notes, 2 accepted by waivers');
    const md = await audit('markdown');
    expect(md.match(/· the waiver covers every finding of consistent-with-registry$/gm)).toHaveLength(2);
    const json = JSON.parse(await audit('json'));
    const c = json.records.find((r: { id: string }) => r.id === 'LX-00003');
    expect(
      c.findings.filter((f: { waived: unknown }) => f.waived).map((f: { waived: unknown }) => f.waived),
    ).toEqual([
      { reason: 'two batches', approvedBy: 'J. Okafor', covers: 'every finding of consistent-with-registry' },
      { reason: 'two batches', approvedBy: 'J. Okafor', covers: 'every finding of consistent-with-registry' },
    ]);
    const sarif = JSON.parse(await audit('sarif'));
    const justifications = sarif.runs[0].results.flatMap(
      (r: { suppressions?: { justification: string }[] }) =>
        r.suppressions?.map((s) => s.justification) ?? [],
    );
    expect(justifications).toContain(
      'two batches (approved by J. Okafor; the waiver covers every finding of consistent-with-registry)',
    );
  });

  it('a narrowed waiver that matches no finding is a note naming what it covers', async () => {
    reg = registry(
      NARROW +
        '  - check: consistent-with-registry\n    other_record: LX-00999\n    reason: old\n    approved_by: A. N. Other\n',
    );
    const text = await audit('text');
    expect(text).toMatch(
      /i note {4}waiver-review line \d+: The waiver waivers\[1\], for consistent-with-registry \(about LX-00999\), matches no finding on this record\./,
    );
    // the first waiver matched its finding in the registry-wide phase: no note for it
    expect(text).not.toContain('waivers[0], for');
  });

  it('a message id of another finding does not accept this one', async () => {
    reg = registry(NARROW.replace('enantiomer-rotation-same-sign', 'enantiomer-form-conflict'));
    const text = await audit('text');
    expect(text).toContain('3 records audited: 1 error, 1 warning, 1 note');
    expect(text).toContain(
      'The waiver waivers[0], for consistent-with-registry (message enantiomer-form-conflict, about LX-00001), matches no finding',
    );
  });

  it('a waiver for enantiomer-registered is in use in a full audit (which lists the pair) and accepts the review note', async () => {
    const waiver =
      'waivers:\n  - check: consistent-with-registry\n    message_id: enantiomer-registered\n' +
      '    other_record: LX-00001\n    reason: both enantiomers on purpose\n    approved_by: J. Okafor\n';
    reg = tmpRegistry({
      'compounds/a.yml': record('LX-00001', R, ''),
      'compounds/b.yml': record('LX-00002', S, '', waiver),
    });
    const text = await audit('text');
    expect(text).toContain('LX-00001 — LX-00002');
    expect(text).not.toContain('matches no finding');
    const io = memoryIo();
    await run(['audit', 'compounds/b.yml', '--root', reg.root, '--fail-on', 'never'], io);
    const review = io.stdout.join('\n');
    expect(review).toContain('1 record audited: 0 errors, 0 warnings, 0 notes, 1 accepted by waiver');
    // the summary of a review says what the record was compared with, not "over 1 record"
    expect(review).toContain(
      'Registry-wide checks of 1 record under review against the registry (2 records): 1 enantiomer pair',
    );
    expect(review).not.toContain('matches no finding');
  });
});
