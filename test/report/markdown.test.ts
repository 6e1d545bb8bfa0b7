/**
 * Markdown checklist, read as rendered: GitHub Flavored Markdown (task list items, autolink literals) rendered by
 * micromark + micromark-extension-gfm (support/gfm.ts); `<details>` is a CommonMark 0.31 HTML block (§4.6, type
 * 6), so the list after its blank line is Markdown again. @mentions are GitHub behaviour (from memory: a mention
 * needs @ directly followed by the name, so a joiner breaks it). Escaping itself: escape.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { CHECKLIST_MARKER, renderMarkdown } from '../../src/report/markdown.js';
import { renderGfm } from './support/gfm.js';
import { sampleResult } from './sample-result.js';
import type { AuditResult } from '../../src/audit/types.js';

const ZWJ = '\u200D';

describe('renderMarkdown', () => {
  const md = renderMarkdown(sampleResult());

  it('starts with the hidden marker and has one caution block', () => {
    expect(md.startsWith(`${CHECKLIST_MARKER}\n`)).toBe(true);
    expect(md.match(/\[!CAUTION\]/g)).toHaveLength(1);
    expect(md).toContain('responsible chemist');
  });

  it('has a heading per record with open findings, with id and file, escaped', () => {
    expect(md).toContain('### LX-00001 · compounds/LX-00001.yml');
    expect(renderGfm(md)).toContain('<h3>LX-00001 · compounds/LX-00001.yml</h3>');
  });

  it('makes only findings to act on task items; notes, waivers and passed checks are not', () => {
    expect(md).toMatch(/^- \[ \] ❌ \*\*error\*\* `form-check` \(line 5\): Declared /m);
    expect(md).toMatch(/^- ℹ️ \*\*note\*\* `ratio-check`: A 1:1 mixture; was it measured\?$/m);
    const html = renderGfm(md);
    // one checkbox: the error; none for the note, the waived finding or the passed checks
    expect(html.match(/<input type="checkbox"/g)).toHaveLength(1);
    expect(html).not.toContain('checked');
  });

  it('puts passed checks in one collapsed line that opens to the list', () => {
    const html = renderGfm(md);
    expect(html).toContain('<details><summary>✅ 1 check passed</summary>');
    expect(html).toMatch(/<li><code>structure-check<\/code>: structure read \(5 atoms\)<\/li>/);
    // a record without open findings is one collapsed line: id, file (HTML-escaped, Markdown left as is), count
    expect(html).toContain(
      `<summary><b>@${ZWJ}owner &lt;script&gt;</b> · compounds/odd name [1].yml — ✅ 1 check passed</summary>`,
    );
    expect(html).toContain('<h3>1 record without open findings</h3>');
  });

  it('lists records with open findings first, errors before warnings before notes', () => {
    const r = sampleResult();
    const clean = r.records[1]!;
    const noteOnly = { ...r.records[0]!, id: 'LX-00003', findings: [r.records[0]!.findings[1]!] };
    r.records = [clean, noteOnly, r.records[0]!];
    const order = [...renderMarkdown(r).matchAll(/^### (\S+)|<summary><b>([^<]+)/gm)].map(
      (m) => m[1] ?? m[2],
    );
    expect(order).toEqual(['LX-00001', 'LX-00003', '1', `@${ZWJ}owner &lt;script&gt;`]);
  });

  it('shows a waived finding as accepted with who and why', () => {
    expect(md).toMatch(/^- ☑️ `rotation-check` accepted by waiver \(line 9\): Rotation sign disagrees\./m);
    expect(md).toContain(
      `Reason: literature value @${ZWJ}chem-leads &lt;b&gt;x&lt;/b&gt; · approved by Dr. R. Vale`,
    );
  });

  it('shows declared against computed evidence', () => {
    expect(md).toContain('Declared: meso, (2R,3S)');
    expect(md).toMatch(/Computed: chiral; no stereo units/);
  });

  it('renders record text as the literal text: no link, image, tag or emphasis from records', () => {
    const html = renderGfm(md);
    expect(html).not.toMatch(/<(a|img|script)[ >]|<strong>bold|<em>i<\/em>/);
    expect(html).toContain('[x](javascript:alert(1))');
    expect(html).toContain('**bold** `code`');
  });

  it('lets no record text through unescaped: no raw @mention, tag, link or image', () => {
    const body = md.replace(CHECKLIST_MARKER, '');
    expect(body).not.toMatch(/@[A-Za-z]/);
    // our own tags only: the collapsed lines
    expect(body.replace(/<\/?(details|summary|b)>/g, '')).not.toMatch(/<[a-z]/i);
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
    expect(short).not.toContain('- [x]');
    expect(short.match(/\[!CAUTION\]/g)).toHaveLength(1);
    const tiny = renderMarkdown(big, { maxChars: 2000, detailsUrl: 'javascript:alert(1)' });
    expect(tiny.length).toBeLessThanOrEqual(2000);
    expect(tiny).not.toContain('javascript');
    expect(tiny).toContain('job summary of this run');
  });
});
