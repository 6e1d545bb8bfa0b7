/**
 * A structure argument that looks like a file path but names no file is "file not found" with exit 2 (usage
 * error), not a SMILES parse error. Convention: common practice for command-line tools, no source. SMILES with
 * '/' bond symbols stay SMILES (OpenSMILES spec, section on directional bonds).
 */
import { describe as suite, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { memoryIo } from './io.js';

async function cli(args: string[]) {
  const io = memoryIo();
  const code = await run(args, io);
  return { code, out: io.stdout.join('\n'), err: io.stderr.join('\n') };
}

suite('missing file arguments', () => {
  it('describe /tmp/nonexist.mol: file not found, exit 2', async () => {
    const r = await cli(['describe', '/tmp/stereogate-nonexist-x91.mol']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/file not found/);
    expect(r.err).not.toMatch(/bond symbol/);
  });
  it('a bare name ending .sdf is also a path', async () => {
    const r = await cli(['describe', 'no-such-records.sdf']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/file not found/);
  });
  it('compare with a missing path: exit 2', async () => {
    const r = await cli(['compare', 'CCO', 'data/none/here']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/structure B: file not found/);
  });
  it('SMILES with / bond symbols is still read as SMILES (OpenSMILES directional bonds)', async () => {
    const r = await cli(['describe', 'C/C=C/C']);
    expect(r.code).toBe(0);
  });
  it('unreadable SMILES with a / bond symbol reports the SMILES error first, not a missing file (issue 10)', async () => {
    const r = await cli(['describe', 'F/C=C/(F']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/^stereogate describe: SMILES argument: bond symbol before '\(' \(character 6\)/);
    expect(r.err).not.toMatch(/file not found/);
  });
  it('invalid SMILES without a slash stays a SMILES error, exit 2', async () => {
    const r = await cli(['describe', 'C(C']);
    expect(r.code).toBe(2);
    expect(r.err).not.toMatch(/file not found/);
  });
});

suite('text output for an open verdict without undefined units', () => {
  it("Tröger's base drawn inconsistently: 'open (see the remarks)', not 'undefined stereo' (from memory)", async () => {
    const r = await cli(['describe', 'CC1=CC2=C(C=C1)[N@]3CC4=C(C=CC(=C4)C)[N@](C2)C3']);
    expect(r.out).toMatch(/Chiral: open \(see the remarks\)/);
    expect(r.out).toMatch(/Meso: open \(see the remarks\)/);
    expect(r.out).not.toMatch(/undefined stereo/);
  });
});
