/** Terminal report: compact blocks, ✓/✗ items, colour only on request; NO_COLOR per no-color.org. */
import { describe, expect, it } from 'vitest';
import { renderText, safeText, shouldColor } from '../../src/report/text.js';
import { sampleResult } from './sample-result.js';

describe('renderText', () => {
  it('prints one block per record with ✗ for findings and ✓ for passed checks, no colour by default', () => {
    const out = renderText(sampleResult());
    expect(out).not.toContain('\u001b[');
    expect(out).toContain('LX-00001  compounds/LX-00001.yml');
    expect(out).toMatch(/✗ error +form-check line 5: Declared ping/);
    expect(out).toMatch(/~ accepted rotation-check: .*approved by Dr\. R\. Vale/);
    expect(out).toMatch(/✓ structure-check: structure read \(5 atoms\)/);
    expect(out).toContain('2 records audited: 1 error, 0 warnings, 1 note, 1 accepted by waiver');
    expect(out.match(/responsible chemist/g)).toHaveLength(1);
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
