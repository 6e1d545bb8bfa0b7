/**
 * Counts in the rendered report agree with their nouns and verbs ("1 stereo unit is", "2 stereo units are"),
 * never "unit(s)": the text report of a real audit, and the template words of every check.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { CHECKS } from '../../src/checks/index.js';
import { render } from '../../src/checks/words.js';
import { recordYaml, tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { memoryIo } from '../cli/io.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

describe('counted words in messages', () => {
  it('the text report says "1 stereo unit is" and "2 stereo units are" from the counts', async () => {
    // butan-2-ol has one stereocentre (C2), butane-2,3-diol two (C2, C3): handbook facts.
    reg = tmpRegistry({
      'compounds/a.yml': recordYaml('LX-00001', 'single-enantiomer', '', 'CC(O)CC'),
      'compounds/b.yml': recordYaml('LX-00002', 'single-enantiomer', '', 'CC(O)C(O)C'),
    });
    const io = memoryIo();
    await run(['audit', '--root', reg.root, '--fail-on', 'never'], io);
    const text = io.stdout.join('\n');
    expect(text).toContain('Declared single-enantiomer, but 1 stereo unit is undefined');
    expect(text).toContain('Declared single-enantiomer, but 2 stereo units are undefined');
    expect(text).not.toMatch(/\w\(s\)/);
  });

  it('{count:one|many} and {count?one|many} pick the words by the count; {name} is unchanged', () => {
    const t = 'at {n?locant|locants} {list}: {n:unit is|units are} open ({x})';
    expect(render(t, { n: 1, list: '2', x: null })).toBe('at locant 2: 1 unit is open (none)');
    expect(render(t, { n: 3, list: '2, 3, 4', x: 'y' })).toBe('at locants 2, 3, 4: 3 units are open (y)');
    expect(render('{n:pair|pairs}', { n: '1' })).toBe('1 pair');
    expect(render('{missing:a|b} {n}', { n: 0 })).toBe('{missing:a|b} 0');
  });

  it('no message template of any check writes a plural as "(s)"', () => {
    const offending = CHECKS.flatMap((c) =>
      Object.entries(c.messages)
        .filter(([, t]) => /\w\(s\)/.test(t))
        .map(([id]) => `${c.id}/${id}`),
    );
    expect(offending).toEqual([]);
  });
});
