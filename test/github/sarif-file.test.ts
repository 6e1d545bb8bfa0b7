import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { rebaseUris, writeSarifFile } from '../../src/github/sarif-file.js';
import { toRegistryPath, toRepoPath } from '../../src/github/paths.js';

// SARIF 2.1.0 (OASIS), §3.4.3: artifactLocation.uri may be relative; GitHub code scanning resolves it against the
// repository root.
const sarif = {
  version: '2.1.0',
  runs: [{ results: [{ locations: [{ physicalLocation: { artifactLocation: { uri: 'compounds/a.yaml' }, region: { startLine: 3 } } }] }, { locations: [{ physicalLocation: { artifactLocation: { uri: 'file:///abs/x.yaml' } } }] }] }],
};

describe('SARIF file', () => {
  it('prefixes relative URIs with the registry folder and leaves absolute ones', () => {
    const out = rebaseUris(sarif, 'registry') as typeof sarif;
    expect(out.runs[0]!.results[0]!.locations[0]!.physicalLocation.artifactLocation.uri).toBe('registry/compounds/a.yaml');
    expect(out.runs[0]!.results[1]!.locations[0]!.physicalLocation.artifactLocation.uri).toBe('file:///abs/x.yaml');
    expect(sarif.runs[0]!.results[0]!.locations[0]!.physicalLocation.artifactLocation.uri).toBe('compounds/a.yaml');
  });

  it('writes JSON, making folders as needed', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'stereogate-sarif-'));
    try {
      const path = join(dir, 'out', 'x.sarif');
      await writeSarifFile(path, sarif, '');
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
