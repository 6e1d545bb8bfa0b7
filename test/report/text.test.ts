/** Terminal report: compact blocks, ✓/✗ items, colour only on request; NO_COLOR per no-color.org. */
import { describe, expect, it } from 'vitest';
import { renderText, safeText, shouldColor } from '../../src/report/text.js';
import { sampleResult } from './sample-result.js';
import type { RecordResult } from '../../src/audit/types.js';

describe('renderText', () => {
  it('leads with the records to act on, each finding with its line, passed checks in one line; no colour', () => {
    const out = renderText(sampleResult());
    expect(out).not.toContain('\u001b[');
    expect(out.startsWith('LX-00001  compounds/LX-00001.yml\n')).toBe(true);
    expect(out).toMatch(/✗ error +form-check line 5: Declared ping/);
    expect(out).toMatch(/~ accepted rotation-check line 9: .*approved by Dr\. R\. Vale/);
    expect(out).toMatch(/^ {2}✓ 1 check passed \(structure-check\)$/m);
    expect(out).not.toContain('structure read (5 atoms)'); // evidence only with verbose
    // a record without open findings: one line
    expect(out).toMatch(/^✓ @owner <script> {2}1 check passed {2}compounds\/odd name \[1\]\.yml$/m);
    expect(out).toContain('2 records audited: 1 error, 0 warnings, 1 note, 1 accepted by waiver');
    expect(out.match(/responsible chemist/g)).toHaveLength(1);
  });

  it('with verbose prints every record in full and every passed check with its evidence', () => {
    const out = renderText(sampleResult(), { verbose: true });
    expect(out).toMatch(/✓ structure-check: structure read \(5 atoms\)/);
    expect(out).toMatch(/^@owner <script> {2}compounds\/odd name \[1\]\.yml\n {2}declared {2}achiral\n/m);
  });

  it('puts records with errors before warnings before notes before clean ones', () => {
    const r = sampleResult();
    const [flagged, clean] = r.records as [RecordResult, RecordResult];
    const warn = {
      ...flagged,
      id: 'LX-W',
      findings: [{ ...flagged.findings[0]!, severity: 'warning' as const }],
    };
    const note = { ...flagged, id: 'LX-N', findings: [flagged.findings[1]!] };
    r.records = [clean, note, warn, flagged];
    const heads = renderText(r)
      .split('\n')
      .filter((l) => /^(✓ )?[@A-Z]/.test(l))
      .map((l) => l.split('  ')[0]);
    expect(heads.slice(0, 4)).toEqual(['LX-00001', 'LX-W', 'LX-N', '✓ @owner <script>']);
  });

  it('fits a clean 40-record audit on one screen: one line per record, then summary and caution', () => {
    const r = sampleResult();
    const clean = r.records[1]!;
    r.records = Array.from({ length: 40 }, (_, i) => ({ ...clean, id: `LX-${String(i).padStart(5, '0')}` }));
    r.summary = { records: 40, errors: 0, warnings: 0, notes: 0, waived: 0 };
    const lines = renderText(r).trimEnd().split('\n');
    // 40 records + blank + summary + caution (common practice, no source: a terminal shows 45-50 lines)
    expect(lines.length).toBe(43);
  });

  it('colours when asked', () => {
    expect(renderText(sampleResult(), { color: true })).toContain('\u001b[31m');
  });

  it('neutralises terminal control sequences from records', () => {
    expect(safeText('a\u001b[2Jb')).toBe('a\\x1b[2Jb');
    const r = sampleResult();
    r.records[0]!.id = 'LX\u001b]0;title\u0007';
    expect(renderText(r)).not.toContain('\u001b]');
  });
});

describe('shouldColor', () => {
  it('needs a TTY and an unset or empty NO_COLOR', () => {
    expect(shouldColor({ isTTY: true }, {})).toBe(true);
    expect(shouldColor({ isTTY: false }, {})).toBe(false);
    expect(shouldColor({}, {})).toBe(false);
    expect(shouldColor({ isTTY: true }, { NO_COLOR: '1' })).toBe(false);
    expect(shouldColor({ isTTY: true }, { NO_COLOR: '' })).toBe(true);
  });
});
