/**
 * Markdown checklist. What GitHub renders as syntax follows CommonMark 0.31 (§2.4: any ASCII punctuation may be
 * backslash-escaped) and the GitHub Flavored Markdown spec (autolinks extension, task list items); @mentions are
 * GitHub behaviour (from memory: a mention needs @ directly followed by the name, so a joiner breaks it).
 */
import { describe, expect, it } from 'vitest';
import { CHECKLIST_MARKER, renderMarkdown } from '../../src/report/markdown.js';
import { escapeMarkdown } from '../../src/report/escape.js';
import { sampleResult } from './sample-result.js';
import type { AuditResult } from '../../src/audit/types.js';

const ZWJ = '\u200D';

describe('escapeMarkdown', () => {
  it('breaks @mentions with a zero-width joiner', () => {
    expect(escapeMarkdown('ask @team')).toBe(`ask @${ZWJ}team`);
    expect(escapeMarkdown('a@b.org')).not.toMatch(/@[a-z]/);
  });
  it('leaves no raw HTML', () => {
    const out = escapeMarkdown('<img src=x onerror=alert(1)><script>x</script>');
    expect(out).not.toMatch(/</);
    expect(out).toContain('&lt;img');
  });
  it('leaves no link or image syntax', () => {
    const out = escapeMarkdown('[x](javascript:alert(1)) ![i](http://e/i.png)');
    expect(out).not.toMatch(/(^|[^\\])\[/);
    expect(out).not.toMatch(/(^|[^\\])\]\(/);
    expect(out).not.toMatch(/(^|[^\\])!\[/);
  });
  it('breaks bare-URL autolinks', () => {
    const out = escapeMarkdown('see https://evil.example and www.evil.example');
    expect(out).not.toContain('https:');
    expect(out).not.toContain('https\\:');
    expect(out).not.toMatch(/www\\\./);
  });
  it('keeps everything on one line', () => {
    expect(escapeMarkdown('a\n# heading\r\n- item')).not.toMatch(/[\r\n]/);
  });
  it('shows a stereo SMILES as a code span, exactly copyable (no joiner after its @)', () => {
    // OpenSMILES: '@'/'@@' inside a bracket atom is tetrahedral stereo, so these tokens are SMILES, not mentions
    expect(escapeMarkdown('mirror image of LX-3 (C[C@H](O)CC), see')).toBe(
      'mirror image of LX\\-3 \\(`C[C@H](O)CC`\\), see',
    );
    expect(escapeMarkdown('drawn as N[C@@H](C)C(=O)O.')).toBe('drawn as `N[C@@H](C)C(=O)O`\\.');
    // link syntax with an @ in its text is shown literally: a code span is never a link (CommonMark §6.1)
    expect(escapeMarkdown('a [x@evil](javascript:alert(1)) b')).toBe('a `[x@evil](javascript:alert(1))` b');
    expect(escapeMarkdown('<b>[C@H]</b>')).toBe('&lt;b&gt;`[C@H]`&lt;/b&gt;');
    expect(escapeMarkdown('mail a@b.org, ask @team')).toBe(`mail a@${ZWJ}b\\.org, ask @${ZWJ}team`);
  });
  it('escapes emphasis, code and table syntax', () => {
    expect(escapeMarkdown('**b** `c` |t| ~~s~~ _i_')).toBe(
      '\\*\\*b\\*\\* \\`c\\` \\|t\\| \\~\\~s\\~\\~ \\_i\\_',
    );
  });
});

describe('renderMarkdown', () => {
  const md = renderMarkdown(sampleResult());

  it('starts with the hidden marker and has one caution block', () => {
    expect(md.startsWith(`${CHECKLIST_MARKER}\n`)).toBe(true);
    expect(md.match(/\[!CAUTION\]/g)).toHaveLength(1);
    expect(md).toContain('responsible chemist');
  });

  it('has a heading per record with id and file, escaped', () => {
    expect(md).toContain('### LX\\-00001 · compounds/LX\\-00001\\.yml');
    expect(md).toContain(`### @${ZWJ}owner &lt;script&gt; · compounds/odd name \\[1\\]\\.yml`);
  });

  it('crossed items for open findings with line, ticked items for passed checks', () => {
    expect(md).toMatch(/^- \[ \] ❌ \*\*error\*\* `form-check` \(line 5\): Declared /m);
    expect(md).toMatch(/^- \[ \] ℹ️ \*\*note\*\* `ratio-check`: A 1\\:1 mixture/m);
    expect(md).toMatch(/^- \[x\] `structure-check`: structure read \\\(5 atoms\\\)$/m);
  });

  it('shows a waived finding as accepted with who and why', () => {
    expect(md).toMatch(
      /^- \[x\] `rotation-check` accepted by waiver \(line 9\): Rotation sign disagrees\\\./m,
    );
    expect(md).toContain(
      `Reason: literature value @${ZWJ}chem\\-leads &lt;b&gt;x&lt;/b&gt; · approved by Dr\\. R\\. Vale`,
    );
  });

  it('shows declared against computed evidence', () => {
    expect(md).toContain('Declared: meso, \\(2R,3S\\)');
    expect(md).toMatch(/Computed: chiral; no stereo units/);
  });

  it('lets no record text through unescaped: no raw @mention, tag, link or image', () => {
    const body = md.replace(CHECKLIST_MARKER, '');
    expect(body).not.toMatch(/@[A-Za-z]/);
    expect(body).not.toMatch(/<[a-z]/i);
    expect(body).not.toMatch(/(^|[^\\])\]\(/);
    expect(body).not.toMatch(/!\[/);
  });

  it('summarises when longer than maxChars and points to the job summary', () => {
    const big: AuditResult = sampleResult();
    const template = big.records[0]!;
    big.records = Array.from({ length: 1000 }, (_, i) => ({
      ...template,
      id: `LX-${String(i).padStart(5, '0')}`,
    }));
    big.summary = { records: 1000, errors: 1000, warnings: 0, notes: 1000, waived: 1000 };
    const full = renderMarkdown(big, { maxChars: 10_000_000 });
    expect(full.length).toBeGreaterThan(60_000);
    const short = renderMarkdown(big, { detailsUrl: 'https://github.com/o/r/actions/runs/1' });
    expect(short.length).toBeLessThanOrEqual(60_000);
    expect(short.startsWith(CHECKLIST_MARKER)).toBe(true);
    expect(short).toContain('[job summary](https://github.com/o/r/actions/runs/1)');
    expect(short).toContain('more records with findings');
    expect(short.match(/\[!CAUTION\]/g)).toHaveLength(1);
    const tiny = renderMarkdown(big, { maxChars: 2000, detailsUrl: 'javascript:alert(1)' });
    expect(tiny.length).toBeLessThanOrEqual(2000);
    expect(tiny).not.toContain('javascript');
    expect(tiny).toContain('job summary of this run');
  });
});
