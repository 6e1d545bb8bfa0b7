/** An in-memory Io for driving the CLI in tests. */
import { existsSync, readFileSync, statSync } from 'node:fs';
import type { Io } from '../../src/cli/command.js';

export function memoryIo(stdin = ''): Io & { stdout: string[]; stderr: string[] } {
  const stdout: string[] = [];
  const stderr: string[] = [];
  return {
    stdout,
    stderr,
    out: (t) => stdout.push(t),
    err: (t) => stderr.push(t),
    readFile: (p) => readFileSync(p, 'utf8'),
    isFile: (p) => existsSync(p) && statSync(p).isFile(),
    readStdin: () => stdin,
  };
}
