/**
 * The options a person reads about are the options that exist: each command's README row names the options of its
 * `--help` synopsis, each synopsis names the options its help explains, and every option docs/bulk.md names is in
 * the bulk audit's help. `--single-threaded-gc` in docs/bulk.md is a Node (V8) flag, not ours.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { memoryIo } from '../cli/io.js';

const OPTION = /--[a-z][a-z-]*/g;
const options = (text: string): string[] => [...new Set(text.match(OPTION) ?? [])].sort();

async function help(args: string[]): Promise<string> {
  const io = memoryIo();
  await run([...args, '--help'], io);
  return [...io.stdout, ...io.stderr].join('\n');
}

/** The synopsis (up to the first blank line) and the explained options (lines that start with an option). */
function split(text: string): { synopsis: string; explained: string } {
  const [synopsis, ...rest] = text.split('\n\n');
  const explained = rest
    .join('\n')
    .split('\n')
    .filter((l) => /^\s+(-[a-z], )?--[a-z]/.test(l))
    .map((l) => l.trim().split(/\s{2,}/)[0]!)
    .join(' ');
  return { synopsis: synopsis!, explained };
}

const readme = readFileSync('README.md', 'utf8');
const readmeRow = (command: string): string => {
  const row = readme.split('\n').find((l) => l.startsWith(`| \`stereogate ${command} `));
  expect(row, `README row for ${command}`).toBeDefined();
  return row!.split('` |')[0]!;
};

describe('command options: README, --help, docs/bulk.md', () => {
  it.each(['describe', 'compare', 'audit'])(
    '%s: README row = --help synopsis = explained options',
    async (c) => {
      const { synopsis, explained } = split(await help([c]));
      expect(options(readmeRow(c))).toEqual(options(synopsis));
      expect(options(explained)).toEqual(options(synopsis));
    },
  );

  it('the bulk help explains every option of its synopses and every option docs/bulk.md names', async () => {
    const text = await help(['merge']);
    const listed = options(split(text).explained);
    const bulkDoc = options(readFileSync('docs/bulk.md', 'utf8')).filter((o) => o !== '--single-threaded-gc');
    // docs/bulk.md also names the record audit's options where it describes record folders through the pool
    const recordAudit = options(split(await help(['audit'])).synopsis);
    expect(bulkDoc.filter((o) => !listed.includes(o) && !recordAudit.includes(o))).toEqual([]);
    expect(options(text.split('\n\n')[1]!).filter((o) => !listed.includes(o))).toEqual([]);
  });
});
