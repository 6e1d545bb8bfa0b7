/** `stereogate compare`: relation names of issue 2 (Gold Book terms), JSON and text. */
import { describe as suite, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { memoryIo } from './io.js';

async function cli(args: string[]) {
  const io = memoryIo();
  const code = await run(args, io);
  return { code, out: io.stdout.join('\n'), err: io.stderr.join('\n') };
}

suite('stereogate compare', () => {
  it('JSON: diastereomers with the differing unit (threose vs erythrose, from memory)', async () => {
    const r = await cli(['compare', 'O=C[C@H](O)[C@H](O)CO', 'O=C[C@H](O)[C@@H](O)CO', '--format', 'json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.relation).toBe('diastereomers');
    expect(j.epimers).toBe(true);
    expect(j.differingUnits).toEqual([
      expect.objectContaining({ kind: 'tetrahedral', atomsA: [5], atomsB: [5] }),
    ]);
  });
  it('text: enantiomers and the inverted centres', async () => {
    const r = await cli(['compare', 'C[C@H](N)C(=O)O', 'C[C@@H](N)C(=O)O']);
    expect(r.out).toMatch(/^Relation: enantiomers/);
    expect(r.out).toMatch(/A 2 S {2}<-> {2}B 2 R/);
  });
  it('text: counter-ions listed apart', async () => {
    const r = await cli(['compare', 'C[C@H](N)C(=O)O.Cl', 'C[C@H](N)C(=O)O']);
    expect(r.out).toMatch(/Relation: identical/);
    expect(r.out).toMatch(/Other components only in A: Cl/);
  });
  it('needs exactly two structures', async () => {
    expect((await cli(['compare', 'CCO'])).code).toBe(2);
    expect((await cli(['compare', 'CCO', 'CCO', 'CCO'])).code).toBe(2);
    expect((await cli(['compare', 'CCO', 'C1C'])).code).toBe(2); // an unreadable structure: input error
  });
});

suite('the caution on describe and compare (every report carries it once)', () => {
  it('text output ends with it; JSON keeps standard output parseable and puts it on standard error', async () => {
    for (const args of [
      ['compare', 'C[C@H](N)C(=O)O', 'C[C@@H](N)C(=O)O'],
      ['describe', 'C[C@H](N)C(=O)O'],
    ]) {
      const text = await cli(args);
      expect(text.out.match(/responsible chemist must confirm/g)).toHaveLength(1);
      const json = await cli([...args, '--format', 'json']);
      expect(() => JSON.parse(json.out)).not.toThrow();
      expect(json.err).toContain('responsible chemist must confirm');
    }
  });
});
