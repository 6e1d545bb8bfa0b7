import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { writeSarifFile } from '../../src/github/sarif-file.js';
import { toRegistryPath, toRepoPath } from '../../src/github/paths.js';

describe('writeSarifFile', () => {
  it('writes the log as JSON, making folders as needed', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'stereogate-sarif-'));
    try {
      const path = join(dir, 'out', 'x.sarif');
      const sarif = { version: '2.1.0', runs: [{ results: [] }] };
      await writeSarifFile(path, sarif);
      expect(JSON.parse(readFileSync(path, 'utf8'))).toEqual(sarif);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('paths', () => {
  it('moves between registry and repository paths', () => {
    expect(toRepoPath('', 'compounds/a.yaml')).toBe('compounds/a.yaml');
    expect(toRepoPath('reg', 'compounds/a.yaml')).toBe('reg/compounds/a.yaml');
    expect(toRegistryPath('reg', 'reg/compounds/a.yaml')).toBe('compounds/a.yaml');
    expect(toRegistryPath('reg', 'other/a.yaml')).toBeNull();
    expect(toRegistryPath('', 'a.yaml')).toBe('a.yaml');
  });
});
