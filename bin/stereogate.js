#!/usr/bin/env node
// stereogate command line. Uses the bundled dist/cli.js when present, else runs the TypeScript sources via tsx.
import { existsSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const bundled = join(root, 'dist', 'cli.js');
let cli;
if (existsSync(bundled)) {
  cli = await import(pathToFileURL(bundled).href);
} else {
  const { register } = await import('tsx/esm/api');
  register();
  cli = await import(pathToFileURL(join(root, 'src', 'cli', 'main.ts')).href);
}
cli.installCrashHandlers?.();
const argv = process.argv.slice(2);
// a bulk audit with a worker on every core restarts once with V8's parallel GC helpers off (src/cli/gc-respawn.ts)
process.exitCode = (await cli.respawnForBulk(argv)) ?? (await cli.run(argv));
