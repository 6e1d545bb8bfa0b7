import { describe, expect, it } from 'vitest';
import { selectChanged } from '../../src/action/select-records.js';
import type { ChangedFile } from '../../src/github/changed-files.js';

const file = (
  path: string,
  status: ChangedFile['status'] = 'modified',
  previousPath: string | null = null,
): ChangedFile => ({
  path,
  status,
  previousPath,
  patch: null,
});

describe('selectChanged', () => {
  it('takes changed record files in the record folders, and changed molfiles, relative to the registry root', () => {
    const selection = selectChanged(
      [
        file('reg/compounds/LX-00002.yaml', 'added'),
        file('reg/compounds/LX-00001.json'),
        file('reg/compounds/gone.yaml', 'removed'),
        file('reg/structures/LX-00003.mol'),
        file('reg/structures/new.mol', 'renamed', 'reg/structures/old.mol'),
        file('reg/README.md'),
        file('reg/stereogate.config.yml'),
        file('.github/workflows/audit.yml'),
        file('other/compounds/LX-9.yaml'),
      ],
      { registryDir: 'reg', recordDirs: ['compounds'] },
    );
    expect(selection.records).toEqual(['compounds/LX-00001.json', 'compounds/LX-00002.yaml']);
    expect(selection.molfiles).toEqual([
      'structures/LX-00003.mol',
      'structures/new.mol',
      'structures/old.mol',
    ]);
  });

  it('works with the registry at the repository root and several record folders', () => {
    const selection = selectChanged([file('a/x.yaml'), file('b/deep/y.yml'), file('c/z.yaml')], {
      registryDir: '',
      recordDirs: ['a', 'b/'],
    });
    expect(selection.records).toEqual(['a/x.yaml', 'b/deep/y.yml']);
  });
});
