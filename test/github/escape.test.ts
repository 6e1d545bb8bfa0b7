import { describe, expect, it } from 'vitest';
import { codeSpan, escapeText } from '../../src/github/escape.js';

// What must not take effect in a GitHub comment (GitHub Flavored Markdown spec 0.29-gfm: images §6.8, raw HTML
// §6.11, autolinks; GitHub docs "Basic writing and formatting syntax": @-mentions and #-references).
describe('escapeText', () => {
  it('neutralises images, links and raw HTML', () => {
    const out = escapeText('![x](https://evil.example/p.png) <img src=x> [a](b)');
    expect(out).not.toMatch(/!\[|<img|\]\(/);
    expect(out).toContain('&#33;&#91;x&#93;&#40;');
  });

  it('breaks @-mentions and #-references with a zero-width space', () => {
    const out = escapeText('ask @octocat about #12');
    expect(out).not.toMatch(/@octocat/);
    expect(out).toContain('&#64;\u200boctocat');
    expect(out).toContain('&#35;\u200b12');
  });

  it('keeps one paragraph: line breaks become spaces, control and bidi characters go', () => {
    expect(escapeText('a\n# heading\r\nb\u202e')).toBe('a &#35;\u200b heading b');
  });

  it('escapes emphasis, code and math markers', () => {
    expect(escapeText('*a* _b_ `c` $d$')).toBe('&#42;a&#42; &#95;b&#95; &#96;c&#96; &#36;d&#36;');
  });

  it('leaves plain chemistry text readable', () => {
    expect(escapeText('LX 00042 is 2R,3S')).toBe('LX 00042 is 2R,3S');
  });
});

describe('codeSpan', () => {
  it('cannot be broken out of with backticks or newlines', () => {
    expect(codeSpan('a`b\nc')).toBe('`a b c`');
  });
});
