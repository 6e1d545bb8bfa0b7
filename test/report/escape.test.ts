/**
 * Markdown escaping of record text. What GitHub renders as syntax follows CommonMark 0.31 (§2.4: any ASCII
 * punctuation may be backslash-escaped, §6.6 raw HTML) and the GitHub Flavored Markdown spec (autolink literals,
 * strikethrough, tables, task list items), checked here by rendering with micromark + micromark-extension-gfm
 * (test/report/support/gfm.ts). @mentions and #123 / GH-123 references are GitHub behaviour (from memory: GitHub
 * links them in the rendered text, so a backslash does not stop them; a zero-width joiner right after `@` or `#`,
 * or inside `GH-`, does).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { escapeHtmlText, escapeMarkdown, escapeMarkdownCounted } from '../../src/report/escape.js';
import { escapeMarkdown as escapeBefore } from './support/escape-before.js';
import { renderGfm, renderedText } from './support/gfm.js';

const ZWJ = '\u200D';

/** Where record text goes in our Markdown: a task item, a plain item, a heading, a line of evidence. */
const CONTEXTS = [
  (t: string) => `- [ ] ❌ **error** \`form-check\` (line 5): ${t}`,
  (t: string) => `- ${t}`,
  (t: string) => `### ${t} · compounds/x.yml`,
  (t: string) => `### LX-1 · ${t}`,
  (t: string) => `Declared: ${t}  \nComputed: chiral`,
];

const REAL_TEXTS = [
  'Declared single-enantiomer, (2R,3S), but the structure has 2 undefined stereocentres: C2, C3.',
  'rac-(1R,2S)-2-aminocyclohexan-1-ol; ratio 50:50; ee 0 %',
  '(+)-tartaric acid [α]D = +12.0 (c 1.0, H2O) — the drawing is (2S,3S)',
  'ask @larkspur-qc about LX-00042 (see #123, GH-7, org/repo#9)',
  'mirror image of LX-3 (C[C@H](O)CC), see N[C@@H](C)C(=O)O.',
  'E/Z: (E)-but-2-ene drawn as C/C=C\\C; 1. first 2) second',
  '- leading dash',
  '+ plus',
  '# heading-like',
  '1. numbered',
  '= underline',
  'a # closing #',
  'price $5 and $x^2$ ~approx~ a|b <b>x</b> &copy; *em* _em_ `code` \\ [l](u) ![i](u)',
  'see https://evil.example, www.evil.example and mailto:a@b.org',
];

describe('escapeMarkdown: only what Markdown needs', () => {
  it('leaves the ordinary punctuation of chemistry alone (readable raw, e.g. in e-mail notifications)', () => {
    expect(escapeMarkdown('single-enantiomer, (2R,3S)')).toBe('single-enantiomer, (2R,3S)');
    expect(escapeMarkdown('ratio 60:40; ee 20.0 %; Dr. R. Vale')).toBe('ratio 60:40; ee 20.0 %; Dr. R. Vale');
    expect(escapeMarkdown('LX-00042 = "meso" + {x}!')).toBe('LX-00042 = "meso" + {x}!');
  });

  it('escapes \\ ` * _ [ ] | ~ $ with a backslash and < > & as character references', () => {
    expect(escapeMarkdown('**b** `c` |t| ~~s~~ _i_ $x$ [l] a\\b')).toBe(
      '\\*\\*b\\*\\* \\`c\\` \\|t\\| \\~\\~s\\~\\~ \\_i\\_ \\$x\\$ \\[l\\] a\\\\b',
    );
    expect(escapeMarkdown('<b>&amp;</b>')).toBe('&lt;b&gt;&amp;amp;&lt;/b&gt;');
  });

  it('escapes a block marker at the start, so the text may open a list item or a heading', () => {
    expect(escapeMarkdown('- x')).toBe('\\- x');
    expect(escapeMarkdown('+ x')).toBe('\\+ x');
    expect(escapeMarkdown('# x')).toBe('\\# x');
    expect(escapeMarkdown('12. x')).toBe('12\\. x');
    expect(escapeMarkdown('3) x')).toBe('3\\) x');
    expect(escapeMarkdown('LX-1 #')).toBe('LX-1 \\#');
    // GFM renders each as the literal text inside a list item (no nested list, no heading)
    for (const t of ['- x', '+ x', '# x', '12. x', '3) x']) {
      expect(renderGfm(`- ${escapeMarkdown(t)}`)).toBe(`<ul>\n<li>${t}</li>\n</ul>`);
    }
    expect(renderGfm(`### ${escapeMarkdown('LX-1 #')}`)).toBe('<h3>LX-1 #</h3>');
  });

  it('breaks @mentions, #123 and GH-123 references and bare-URL autolinks with a zero-width joiner', () => {
    expect(escapeMarkdown('ask @team')).toBe(`ask @${ZWJ}team`);
    expect(escapeMarkdown('see #123 and GH-7')).toBe(`see #${ZWJ}123 and G${ZWJ}H-7`);
    expect(escapeMarkdown('org/repo#9')).toBe(`org/repo#${ZWJ}9`);
    expect(escapeMarkdown('C#N stays')).toBe('C#N stays'); // a SMILES triple bond is no reference
    expect(escapeMarkdown('https://x.org www.x.org')).toBe(`https${ZWJ}://x.org w${ZWJ}ww.x.org`);
    const html = renderGfm(escapeMarkdown('mail a@b.org, https://evil.example, www.evil.example'));
    expect(html).not.toContain('<a ');
  });

  it('shows a stereo SMILES as a code span, exactly copyable (no joiner after its @)', () => {
    // OpenSMILES: '@'/'@@' inside a bracket atom is tetrahedral stereo, so these tokens are SMILES, not mentions
    expect(escapeMarkdown('mirror image of LX-3 (C[C@H](O)CC), see')).toBe(
      'mirror image of LX-3 (`C[C@H](O)CC`), see',
    );
    expect(escapeMarkdown('drawn as N[C@@H](C)C(=O)O.')).toBe('drawn as `N[C@@H](C)C(=O)O`.');
    // link syntax with an @ in its text is shown literally: a code span is never a link (CommonMark §6.1)
    expect(escapeMarkdown('a [x@evil](javascript:alert(1)) b')).toBe('a `[x@evil](javascript:alert(1))` b');
    expect(escapeMarkdown('<b>[C@H]</b>')).toBe('&lt;b&gt;`[C@H]`&lt;/b&gt;');
    expect(renderGfm(escapeMarkdown('drawn as N[C@@H](C)C(=O)O.'))).toBe(
      '<p>drawn as <code>N[C@@H](C)C(=O)O</code>.</p>',
    );
  });

  it('keeps everything on one line', () => {
    expect(escapeMarkdown('a\n# heading\r\n- item')).not.toMatch(/[\r\n]/);
  });

  it('renders exactly as the former escaping did (every punctuation mark escaped), in every context', () => {
    for (const text of REAL_TEXTS) {
      for (const ctx of CONTEXTS) {
        expect(renderedText(ctx(escapeMarkdown(text))), `${text} in ${ctx('…')}`).toBe(
          renderedText(ctx(escapeBefore(text))),
        );
      }
    }
  });

  it('renders as the former escaping did, and as the literal text, for random text (fast-check, seeded)', () => {
    const alphabet = fc.constantFrom(
      ...'ab1 2-.(),:;#@!?*_`~|$[]<>&\\/=+{}"\'^%CNOH'.split(''),
      'www.',
      'http://',
      '[C@H]',
      'GH-1',
      '#12',
      '\u00a0',
      'é',
    );
    fc.assert(
      fc.property(fc.array(alphabet, { maxLength: 40 }), fc.constantFrom(...CONTEXTS), (parts, ctx) => {
        const text = parts.join('');
        const html = renderedText(ctx(escapeMarkdown(text)));
        const before = renderedText(ctx(escapeBefore(text)));
        // the former escaping let "1http://a" through as a link; there the new one must differ
        if (!before.includes('<a ')) expect(html).toBe(before);
        expect(html).not.toMatch(
          /<(a|img|script|em|strong|del|code|h[1-6]|table|ol)[ >]/.source.replace('|code', ''),
        );
      }),
      { seed: 15, numRuns: 400 },
    );
  });

  it('is linear: 100 KB of hostile text is escaped within a small multiple of its length in steps', () => {
    // the former escaping was cubic on runs of '[' and quadratic on long words (a 3 KB descriptor took 12 s)
    const hostile = [
      '['.repeat(20_000),
      'a'.repeat(20_000),
      'https:'.repeat(3_000),
      '[@'.repeat(5_000) + ']',
      'a(a'.repeat(4_000) + '[C@H]' + ')'.repeat(2_000),
      '.'.repeat(10_000) + 'x',
      '(' + '#'.repeat(5_000) + '@'.repeat(5_000) + 'www.'.repeat(2_000),
      'C[C@H]' + ')'.repeat(5_000) + ','.repeat(5_000),
    ];
    for (const chunk of hostile) {
      const { text, steps } = escapeMarkdownCounted(chunk);
      expect(steps, chunk.slice(0, 20)).toBeLessThanOrEqual(6 * chunk.length);
      expect(text.length).toBeLessThanOrEqual(5 * chunk.length);
    }
    const all = hostile.join(' ');
    expect(all.length).toBeGreaterThan(100_000);
    const { steps } = escapeMarkdownCounted(all);
    expect(steps).toBeLessThanOrEqual(6 * all.length);
  });
});

describe('escapeHtmlText (a <summary> line, where GitHub reads no Markdown)', () => {
  it('escapes HTML and keeps the joiners; leaves Markdown punctuation as it is', () => {
    expect(escapeHtmlText('LX-1 <b> "a" & @team #12 [x]')).toBe(
      `LX-1 &lt;b&gt; &quot;a&quot; &amp; @${ZWJ}team #${ZWJ}12 [x]`,
    );
    expect(
      renderGfm(`<details><summary>${escapeHtmlText('odd [1]_x_.yml')}</summary>\n\nx\n\n</details>`),
    ).toContain('<summary>odd [1]_x_.yml</summary>');
  });
});
