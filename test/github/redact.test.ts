import { describe, expect, it } from 'vitest';
import { capComment } from '../../src/action/post-review.js';
import { MASK, redactSecret } from '../../src/github/redact.js';
import { escapeMarkdown } from '../../src/report/escape.js';

describe('redactSecret', () => {
  const token = 'ghs_Ab_cD-12.x';
  it('masks the token as written and in its Markdown-escaped, JSON and URL forms', () => {
    const text = [token, escapeMarkdown(token), JSON.stringify(token), encodeURIComponent(token)].join(' | ');
    const out = redactSecret(text, token);
    expect(out).not.toContain('Ab_cD');
    expect(out).not.toContain('Ab\\_cD');
    expect(out.split(MASK).length - 1).toBeGreaterThanOrEqual(4);
  });
  it('leaves text alone without a token (or a token too short to mask safely)', () => {
    expect(redactSecret('no secret here', '')).toBe('no secret here');
    expect(redactSecret('a b c', 'a')).toBe('a b c');
  });
});

describe('capComment', () => {
  it('cuts a long comment at a line end, keeps the marker line, and says where the rest is', () => {
    const body = [
      '<!-- stereogate-checklist -->',
      ...Array.from({ length: 5000 }, (_, i) => `- item ${i}`),
    ].join('\n');
    const cut = capComment(body, 10_000);
    expect(cut.length).toBeLessThanOrEqual(10_000);
    expect(cut.startsWith('<!-- stereogate-checklist -->\n')).toBe(true);
    expect(cut).toMatch(
      /- item \d+\n\n… \(cut to fit GitHub's comment size limit; the full checklist is in the job summary\)\n$/,
    );
    expect(capComment('short', 10)).toBe('short');
  });
});
