/**
 * `stereogate describe` text: the one-line state of a unit the input leaves open says why, and the reason agrees
 * with the remark below it. BINOL's axis, hexahelicene's helix and (E)-cyclooctene's planar twist are the usual
 * examples of each kind of unit (Eliel & Wilen 1994, from memory). What each input can state: a SMILES has no
 * notation for an axis, a helix or a planar twist; a CXSMILES states an axis with 2D coordinates and a wedge
 * (ChemAxon's CXSMILES format description); a wedge without coordinates can be drawn reflected in a line, which
 * is the mirror image, so it states nothing (see test/chem/read/cxsmiles-axes.test.ts).
 */
import { describe as suite, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { memoryIo } from './io.js';

async function text(structure: string): Promise<string> {
  const io = memoryIo('');
  expect(await run(['describe', structure], io)).toBe(0);
  return io.stdout.join('\n');
}

const unitLine = (out: string, kind: string): string =>
  out.split('\n').find((l) => l.trimStart().startsWith(`${kind} `)) ?? '';

const BINOL = 'Oc1ccc2ccccc2c1-c1c(O)ccc2ccccc12';

suite('describe: why an open unit is open', () => {
  it('a plain SMILES axis: SMILES states it only with 2D coordinates and a wedge', async () => {
    const out = await text(BINOL);
    expect(unitLine(out, 'biaryl')).toMatch(
      /open \(a SMILES without 2D coordinates and wedges cannot state its configuration\)$/,
    );
    expect(out).toMatch(
      /Remark: .*a SMILES without 2D coordinates and wedges cannot state its configuration/,
    );
    expect(out).not.toMatch(/input format/);
  });

  it('a CXSMILES axis with a wedge but no coordinates: the wedge fixes nothing, not "the format cannot state it"', async () => {
    // wU:11.13 = a wedge from atom 11 (0-based, an axis atom) on bond 13, to its ortho atom 12
    const out = await text(`${BINOL} |wU:11.13|`);
    expect(unitLine(out, 'biaryl')).toMatch(
      /open \(a wedge without 2D coordinates fixes no configuration\)$/,
    );
    expect(out).toMatch(/Remark: .*without 2D coordinates a wedge fixes no configuration/);
    expect(out).not.toMatch(/cannot state/);
  });

  it('a helix in SMILES', async () => {
    const out = await text('c1ccc2c(c1)ccc1ccc3ccc4ccc5ccccc5c4c3c12');
    expect(unitLine(out, 'helix')).toMatch(/open \(a SMILES cannot state its configuration\)$/);
    expect(out).toMatch(/Remark: .*form a helix; a SMILES cannot state its configuration/);
  });

  it('a planar twist: in SMILES, and with 2D coordinates (only 3D coordinates state it)', async () => {
    expect(unitLine(await text('C1=C/CCCCCC/1'), 'planar')).toMatch(
      /open \(a SMILES cannot state its configuration\)$/,
    );
    const flat = 'C1=C/CCCCCC/1 |(0,0,;1.3,0,;2.2,1,;2.2,2.4,;1.3,3.4,;0,3.4,;-0.9,2.4,;-0.9,1,)|';
    const out = await text(flat);
    expect(unitLine(out, 'planar')).toMatch(/open \(2D coordinates cannot state its configuration\)$/);
    expect(out).toMatch(
      /Remark: .*; 2D coordinates cannot state its configuration: .*\(3D coordinates state it\)/,
    );
  });
});
