/**
 * The bulk audit's one restart with V8's parallel GC helpers off (src/cli/gc-respawn.ts): when it happens, that
 * the restarted process gets the flag once, and that the exit code and output come through. The rule (a worker
 * on every core) is our measurement, not a published one (common practice, no source).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  bulkWorkers,
  GC_FLAG,
  NO_RESPAWN_ENV,
  respawnArgs,
  wantsSingleThreadedGc,
} from '../../src/cli/gc-respawn.js';

describe('when the command line restarts itself', () => {
  it('only for a bulk audit with a worker on every core', () => {
    expect(wantsSingleThreadedGc(2, 2)).toBe(true);
    expect(wantsSingleThreadedGc(1, 4)).toBe(false);
    expect(wantsSingleThreadedGc(0, 1)).toBe(false); // workers 0: the main thread audits
    expect(bulkWorkers(['audit', 'legacy.csv'], 2)).toBe(2);
    expect(bulkWorkers(['audit', 'legacy.sdf', '--workers', '1'], 2)).toBe(1);
    expect(bulkWorkers(['audit', '--workers=3', 'x.tsv'], 2)).toBe(3);
    expect(bulkWorkers(['audit', '--root', 'fixtures/demo-registry'], 2)).toBeNull(); // record files
    expect(bulkWorkers(['describe', 'x.csv'], 2)).toBeNull();
    expect(bulkWorkers(['audit', 'x.csv', '--help'], 2)).toBeNull();
  });

  it('puts the flag first, keeps the node flags and the script, and never restarts twice', () => {
    const argv = ['audit', 'legacy.csv', '--fail-on', 'never'];
    expect(respawnArgs(argv, ['--import', 'tsx'], '/x/cli.js', {}, 2)).toEqual([
      GC_FLAG,
      '--import',
      'tsx',
      '/x/cli.js',
      ...argv,
    ]);
    expect(respawnArgs(argv, [GC_FLAG], '/x/cli.js', {}, 2)).toBeNull();
    expect(respawnArgs(argv, [], '/x/cli.js', { [NO_RESPAWN_ENV]: '1' }, 2)).toBeNull();
    expect(respawnArgs([...argv, '--workers', '1'], [], '/x/cli.js', {}, 2)).toBeNull();
  });

  it('passes the exit code and the summary through the restart (bundle, dist/cli.js)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'stereogate-respawn-'));
    const csv = join(dir, 'legacy.csv');
    // meso-tartaric acid (2R,3S; IUPAC Gold Book, "meso") declared a racemate: an error (it is achiral), so
    // --fail-on error exits 1
    writeFileSync(csv, 'id,smiles,stereo_form\nLX-1,OC(=O)[C@@H](O)[C@@H](O)C(=O)O,racemate\n');
    const cli = new URL('../../dist/cli.js', import.meta.url).pathname;
    const r = spawnSync(
      process.execPath,
      [cli, 'audit', csv, '--workers', String(availableParallelism()), '--progress', 'none'],
      {
        encoding: 'utf8',
        env: { ...process.env, [NO_RESPAWN_ENV]: '' },
      },
    );
    expect(r.status).toBe(1);
    expect(r.stdout).toContain('stereogate bulk audit: 1 record in');
    expect(r.stdout).toMatch(/form-matches-structure\s+1/);
  });
});
