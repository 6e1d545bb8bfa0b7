/**
 * `stereogate describe`: the JSON interface promised in issue 2 and the plain-text form. Chemistry values are
 * textbook cases (Eliel & Wilen 1994, from memory); atom numbering follows the CIP validation suite convention
 * (Hanson et al., J. Chem. Inf. Model. 2018): input order, explicit H atoms counted, bracket H not.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe as suite, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { memoryIo } from './io.js';

async function cli(args: string[], stdin = '') {
  const io = memoryIo(stdin);
  const code = await run(args, io);
  return { code, out: io.stdout.join('\n'), err: io.stderr.join('\n') };
}

suite('stereogate describe', () => {
  it('prints the JSON fields of the issue for (R,R)-tartaric acid', async () => {
    const r = await cli(['describe', 'OC(=O)[C@@H](O)[C@H](O)C(O)=O', '--format', 'json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.stereocenters.map((c: { atom: number }) => c.atom)).toEqual([4, 6]);
    expect(j.stereocenters[0].label).toMatch(/^[RS]$/);
    expect(j).toMatchObject({ stereobonds: [], chiral: true, meso: false, undefined: 0 });
    expect(j.stereoisomers).toMatchObject({ total: 3, chiral: 2, achiral: 1 });
  });
  it('stereobonds carry atoms [a, b] and E/Z; undefined units have label null', async () => {
    const j = JSON.parse((await cli(['describe', 'C/C=C/C(O)CC', '--format', 'json'])).out);
    expect(j.stereobonds).toEqual([expect.objectContaining({ atoms: [2, 3], label: 'E', defined: true })]);
    expect(j.stereocenters).toEqual([expect.objectContaining({ atom: 4, label: null, defined: false })]);
    expect(j.undefined).toBe(1);
    expect(j.chiral).toBe(true);
  });
  it('explicit hydrogen atoms count in the numbering', async () => {
    const j = JSON.parse((await cli(['describe', '[H]O[C@@H](C)CC', '--format', 'json'])).out);
    expect(j.stereocenters.map((c: { atom: number }) => c.atom)).toEqual([3]);
  });
  it('text output reads like a note to a chemist', async () => {
    const r = await cli(['describe', 'OC(=O)[C@@H](O)[C@@H](O)C(O)=O']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Stereocentres: 2 \(2 defined\)/);
    expect(r.out).toMatch(/Chiral: no — mirror plane or inversion centre/);
    expect(r.out).toMatch(/Meso: yes/);
    expect(r.out).toMatch(
      /Stereoisomers of this constitution: 3 \(2 chiral = 1 enantiomer pair, 1 achiral, of which 1 meso\)/,
    );
  });
  it('--list gives every stereoisomer with SMILES and labels, the input marked', async () => {
    const j = JSON.parse(
      (await cli(['describe', 'OC(=O)[C@@H](O)[C@@H](O)C(O)=O', '--list', '--format', 'json'])).out,
    );
    expect(j.stereoisomerList).toHaveLength(3);
    expect(j.stereoisomerList.filter((e: { isInput: boolean }) => e.isInput)).toHaveLength(1);
    expect(j.stereoisomerList.filter((e: { chiral: boolean }) => !e.chiral)).toHaveLength(1);
  });
  it('an invertible amine nitrogen is named in text and JSON', async () => {
    const r = await cli(['describe', 'C[N@](CC)CCC']);
    expect(r.out).toMatch(/Stereocentres: none/);
    expect(r.out).toMatch(/invertible amine nitrogen/);
  });
  it('reads a SMILES file and standard input', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'stereogate-'));
    const file = join(dir, 'x.smi');
    writeFileSync(file, 'C[C@H](N)C(=O)O alanine\n');
    const a = JSON.parse((await cli(['describe', file, '--format', 'json'])).out);
    expect(a.stereocenters).toEqual([expect.objectContaining({ atom: 2, label: 'S' })]); // L-alanine is (S), from memory
    const b = JSON.parse((await cli(['describe', '-', '--format', 'json'], 'C[C@H](N)C(=O)O')).out);
    expect(b.stereocenters[0].label).toBe('S');
  });
  it('usage errors and unreadable structures exit 2 with a message (1 is kept for findings)', async () => {
    expect((await cli(['describe'])).code).toBe(2);
    const bad = await cli(['describe', 'CCO', '--format', 'xml']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--format must be one of json, text/);
    expect((await cli(['describe', 'CCO', '--bogus'])).code).toBe(2);
    expect((await cli(['nosuch'])).code).toBe(2);
    const unread = await cli(['describe', 'C1CC']);
    expect(unread.code).toBe(2);
    expect(unread.err).toMatch(/character/);
    expect(unread.err).not.toMatch(/Usage:/); // one line, not the usage
  });
  it('--help lists the commands', async () => {
    const r = await cli(['--help']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/describe/);
    expect(r.out).toMatch(/compare/);
  });
});
