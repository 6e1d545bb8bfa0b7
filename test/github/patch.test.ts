import { describe, expect, it } from 'vitest';
import { parsePatch } from '../../src/github/patch.js';

// Hunk headers per the GNU diffutils manual, "Detailed Description of Unified Format"; a missing count means 1.
describe('parsePatch', () => {
  it('numbers the right-hand side of each hunk', () => {
    const patch = [
      '@@ -3,4 +3,5 @@ structure:',
      ' structure:', // 3
      '   smiles: "C[C@H](N)O"', // 4
      ' stereo:', // 5
      '-  form: racemate',
      '+  form: single-enantiomer', // 6
      '+  descriptors: "(S)"', // 7
      '@@ -20 +21 @@',
      '-  ee: 90',
      '+  ee: 99', // 21
      '\\ No newline at end of file',
    ].join('\n');
    const lines = parsePatch(patch);
    expect([...lines.commentable].sort((a, b) => a - b)).toEqual([3, 4, 5, 6, 7, 21]);
    expect([...lines.added].sort((a, b) => a - b)).toEqual([6, 7, 21]);
  });

  it('handles a new file and ignores git file headers', () => {
    const patch = [
      'diff --git a/x.yaml b/x.yaml',
      '--- /dev/null',
      '+++ b/x.yaml',
      '@@ -0,0 +1,2 @@',
      '+id: LX-1',
      '+name: a',
    ].join('\n');
    const lines = parsePatch(patch);
    expect([...lines.added]).toEqual([1, 2]);
    expect(lines.commentable.has(3)).toBe(false);
  });

  it('gives nothing for an empty patch', () => {
    expect(parsePatch('').commentable.size).toBe(0);
  });
});
