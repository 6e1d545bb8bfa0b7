import { describe, expect, it } from 'vitest';
import { INLINE_MARKER, planInlineComments } from '../../src/github/inline-plan.js';
import { parsePatch } from '../../src/github/patch.js';
import { finding, record, result } from './support/results.js';

const diffs = new Map([
  [
    'registry/compounds/LX-00001.yaml',
    parsePatch('@@ -5,3 +5,3 @@\n stereo:\n-  form: achiral\n+  form: racemate\n   ee: 0'),
  ],
]);
const options = { registryDir: 'registry', max: 10, checklistUrl: 'https://github.test/c/5' };

describe('planInlineComments', () => {
  it('comments only on lines shown in the diff, on the repository path', () => {
    const audit = result([
      record('compounds/LX-00001.yaml', [finding('error', 6), finding('warning', 30), finding('note', null)]),
      record('compounds/LX-00009.yaml', [finding('error', 6)], 'LX-00009'),
    ]);
    const plan = planInlineComments(audit, diffs, options);
    expect(plan.comments.map((c) => [c.path, c.line])).toEqual([['registry/compounds/LX-00001.yaml', 6]]);
    expect(plan.outsideDiff).toBe(2); // line 30 and the untouched record; the line-less note is not counted
    expect(plan.comments[0]!.body).toContain(INLINE_MARKER);
    // One short caution line pointing to the checklist, not the whole caution (issue 15).
    const body = plan.comments[0]!.body;
    expect(body.split('\n').filter((l) => /responsible chemist/.test(l))).toHaveLength(1);
    expect(body).toContain('Full caution in the [checklist comment](https://github.test/c/5)');
  });

  it('does not comment on waived findings', () => {
    const audit = result([
      record('compounds/LX-00001.yaml', [
        finding('error', 6, { waived: { reason: 'ok', approvedBy: 'Dr K' } }),
      ]),
    ]);
    expect(planInlineComments(audit, diffs, options).comments).toEqual([]);
  });

  it('joins findings on one line into one comment, errors first, and keeps to the limit', () => {
    const many = new Map([['compounds/a.yaml', parsePatch('@@ -0,0 +1,3 @@\n+a\n+b\n+c')]]);
    const audit = result([
      record('compounds/a.yaml', [
        finding('note', 1),
        finding('error', 1, { check: 'ratio-sums-to-100' }),
        finding('warning', 2),
        finding('error', 3),
      ]),
    ]);
    const plan = planInlineComments(audit, many, { registryDir: '', max: 2 });
    expect(plan.comments.map((c) => c.line)).toEqual([1, 3]);
    expect(plan.overLimit).toBe(1);
    const first = plan.comments[0]!.body;
    expect(first.indexOf('ratio-sums-to-100')).toBeLessThan(first.indexOf('ℹ️ note'));
  });

  it('escapes what comes from the record: no mention, no image, no HTML', () => {
    const evil = finding('error', 6, {
      message: 'name "@octocat ![x](https://evil.example/i.png) <script>" disagrees',
    });
    const audit = result([record('compounds/LX-00001.yaml', [evil], 'LX-1 @team')]);
    const body = planInlineComments(audit, diffs, options).comments[0]!.body;
    // Escaped as the checklist comment escapes (src/report/escape.ts): a joiner after @, punctuation backslashed.
    expect(body).not.toMatch(/@octocat|!\[|<script|https:\/\/evil\.example\/i\.png\)/);
    expect(body).toContain('LX-1 @\u200Dteam');
  });
});
