#!/usr/bin/env node
/* global console, process */
/**
 * Builds the committed bundles with esbuild: src/action/main.ts -> dist/index.js (the GitHub Action),
 * src/cli/main.ts -> dist/cli.js, src/bulk/worker.ts -> dist/worker.js (the bulk audit's worker, found next to
 * the CLI bundle) and src/audit/index-worker.ts -> dist/index-worker.js (the registry index's worker). ES
 * modules for Node 20 and later; a createRequire banner lets bundled CommonJS code call require(). The output
 * is deterministic: no timestamps, no absolute paths, no licence comments.
 *
 *   node scripts/bundle.mjs                 # write dist/
 *   node scripts/bundle.mjs --outdir DIR    # write elsewhere (the "dist is fresh" test compares the two)
 */
import { existsSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { build } from 'esbuild';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

export const ENTRIES = [
  { in: 'src/action/main.ts', out: 'index' },
  { in: 'src/cli/main.ts', out: 'cli' },
  { in: 'src/bulk/worker.ts', out: 'worker' },
  { in: 'src/audit/index-worker.ts', out: 'index-worker' },
];

const BANNER =
  "import { createRequire as __stereogateCreateRequire } from 'node:module';\n" +
  'const require = __stereogateCreateRequire(import.meta.url);';

/** Bundles every entry that exists into `outdir`; returns the output file names written. */
export async function bundle(outdir) {
  const entries = ENTRIES.filter((e) => existsSync(join(root, e.in)));
  for (const missing of ENTRIES.filter((e) => !entries.includes(e))) {
    console.warn(`bundle: ${missing.in} does not exist yet; ${missing.out}.js not built`);
  }
  await build({
    absWorkingDir: root,
    entryPoints: entries.map((e) => ({ in: e.in, out: e.out })),
    outdir,
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outExtension: { '.js': '.js' },
    banner: { js: BANNER },
    legalComments: 'none',
    sourcemap: false,
    minify: false,
    charset: 'utf8',
    logLevel: 'warning',
  });
  return entries.map((e) => `${e.out}.js`);
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const at = process.argv.indexOf('--outdir');
  const outdir = at >= 0 ? resolve(process.argv[at + 1] ?? '') : join(root, 'dist');
  try {
    const written = await bundle(outdir);
    console.log(`bundle: wrote ${written.map((f) => join(outdir, f)).join(', ')}`);
  } catch {
    // esbuild has already printed the errors
    process.exitCode = 1;
  }
}
