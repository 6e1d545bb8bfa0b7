/**
 * The committed bundles must be what scripts/bundle.mjs builds from the sources now ("dist is fresh"): rebuild
 * into a temporary folder and compare byte for byte. Rebuild with `npm run bundle` as the last step before a commit.
 */
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, describe, expect, it } from 'vitest';

const run = promisify(execFile);
const dist = resolve('dist');
const committed = existsSync(join(dist, 'index.js'));
if (!committed)
  console.warn(
    'dist-fresh: dist/index.js does not exist yet (run npm run bundle); the freshness check is skipped.',
  );

describe.skipIf(!committed)('dist/ is fresh', () => {
  const out = mkdtempSync(join(tmpdir(), 'stereogate-dist-'));
  afterAll(() => rmSync(out, { recursive: true, force: true }));

  it('rebuilding gives the committed files byte for byte', async () => {
    await run(process.execPath, ['scripts/bundle.mjs', '--outdir', out], { maxBuffer: 16 * 1024 * 1024 });
    const built = readdirSync(out).sort();
    expect(built).toContain('index.js');
    for (const name of built) {
      const fresh = readFileSync(join(out, name));
      const old = existsSync(join(dist, name)) ? readFileSync(join(dist, name)) : null;
      expect(
        old === null
          ? `${name} missing from dist/`
          : old.equals(fresh)
            ? 'same'
            : `${name} differs: run npm run bundle`,
      ).toBe('same');
    }
  });

  it('building twice gives the same bytes (no timestamps or absolute paths)', async () => {
    const again = join(out, 'again');
    await run(process.execPath, ['scripts/bundle.mjs', '--outdir', again], { maxBuffer: 16 * 1024 * 1024 });
    const text = readFileSync(join(again, 'index.js'), 'utf8');
    expect(readFileSync(join(out, 'index.js')).equals(readFileSync(join(again, 'index.js')))).toBe(true);
    expect(text).not.toContain(resolve('.'));
  });
});
