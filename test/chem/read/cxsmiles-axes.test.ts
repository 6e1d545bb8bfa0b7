/**
 * Atropisomeric axes from CXSMILES wedges (`wU:`/`wD:`, atom index then bond index; ChemAxon's CXSMILES format
 * description, RDKit writes and reads them for atropisomers).
 *
 * Reference: the same drawing as a molfile. RDKit MinimalLib (@rdkit/rdkit) draws BINOL and
 * 6,6'-dinitrobiphenyl-2,2'-dicarboxylic acid in 2D; we put a wedge (one enantiomer) or a hash (the other) on a
 * single ring bond from an axis atom to an ortho atom, read that molfile with our molfile reader, and then have
 * RDKit write the molfile as CXSMILES (with its coordinates and its own choice of wedge). The axis label read
 * from the CXSMILES must be the molfile's; RDKit's own axis label (get_stereo_tags, its new CIP labeller) is a
 * second opinion and must agree too. Both compounds are resolved atropisomers (from memory; see
 * test/chem/axes-helices.test.ts).
 *
 * Without coordinates a wedge states nothing: the same SMILES and the same wedge drawn reflected in a line are the
 * mirror image (checked below with RDKit's coordinates, y -> -y: both labellers invert). RDKit still labels such a
 * CXSMILES, from a layout it computes itself; that is its convention, not something the text says, so we leave
 * the axis open and say what is missing.
 */
import { beforeAll, describe as suite, expect, it } from 'vitest';
import { describe } from '../../../src/chem/describe/index.js';
import { parseMolfile } from '../../../src/chem/read/index.js';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import { relate } from '../../../src/chem/relate.js';
import type { Structure } from '../../../src/chem/types.js';
import { loadRdkit, type RdkitModule } from '../graph/rdkit.js';

const BINOL = 'OC1=CC=C2C=CC=CC2=C1C1=C2C=CC=CC2=CC=C1O';
const DINITRO = 'OC(=O)c1cccc([N+](=O)[O-])c1-c1c(cccc1[N+](=O)[O-])C(O)=O';

function read(text: string): Structure {
  const r = text.includes('V2000') ? parseMolfile(text) : parseSmiles(text);
  if (!r.ok) throw new Error(`unreadable test input: ${r.error.code} ${r.error.message}`);
  return r.structure;
}

/** The one biaryl unit's [defined, label] as describe reports it. */
function axis(s: Structure): [boolean, string | null] {
  const units = describe(s).units.filter((u) => u.kind === 'biaryl');
  expect(units).toHaveLength(1);
  return [units[0]!.defined, units[0]!.label];
}

/**
 * RDKit's 2D molfile of `smiles` with a wedge ('1') or hash ('6') put on a single bond from an axis atom to one
 * of its ring neighbours (the axis found by our perception of the unwedged drawing).
 */
function wedgedMolfile(rd: RdkitModule, smiles: string, stereo: '1' | '6'): string {
  const m = rd.get_mol(smiles)!;
  (m as unknown as { set_new_coords(): void }).set_new_coords();
  const lines = (m as unknown as { get_molblock(): string }).get_molblock().split('\n');
  m.delete();
  const plain = read(lines.join('\n'));
  const unit = describe(plain).units.find((u) => u.kind === 'biaryl')!;
  const [x, y] = unit.atoms;
  const n = Number(lines[3]!.slice(0, 3));
  for (let i = 4 + n; i < lines.length; i++) {
    const a = Number(lines[i]!.slice(0, 3));
    const b = Number(lines[i]!.slice(3, 6));
    const order = lines[i]!.slice(6, 9).trim();
    if (order !== '1') continue;
    const end = a === x || a === y ? a : b === x || b === y ? b : 0;
    const other = end === a ? b : a;
    if (end === 0 || other === x || other === y) continue;
    lines[i] = `${String(end).padStart(3)}${String(other).padStart(3)}  1  ${stereo}`;
    return lines.join('\n');
  }
  throw new Error('no single ring bond at the axis');
}

interface Rdkit {
  cx: string;
  label: string;
}

/** RDKit's CXSMILES of a molfile and its own axis label ('M' or 'P'). */
function rdkitView(rd: RdkitModule, molfile: string): Rdkit {
  const m = rd.get_mol(molfile)!;
  const cx = (m as unknown as { get_cxsmiles(): string }).get_cxsmiles();
  const tags = JSON.parse((m as unknown as { get_stereo_tags(): string }).get_stereo_tags()) as {
    CIP_bonds: [number, number, string][];
  };
  m.delete();
  expect(tags.CIP_bonds).toHaveLength(1);
  return { cx, label: tags.CIP_bonds[0]![2].replace(/[()]/g, '') };
}

let rd: RdkitModule;
beforeAll(async () => {
  rd = await loadRdkit();
});

suite('CXSMILES wedges on a stereogenic axis (RDKit MinimalLib writes the CXSMILES)', () => {
  for (const [name, smiles] of [
    ['BINOL', BINOL],
    ["6,6'-dinitrobiphenyl-2,2'-dicarboxylic acid", DINITRO],
  ] as const) {
    it(`${name}: the CXSMILES gives the molfile's label, the two wedges opposite ones, and RDKit agrees`, () => {
      const seen: string[] = [];
      for (const stereo of ['1', '6'] as const) {
        const molfile = wedgedMolfile(rd, smiles, stereo);
        const fromMolfile = axis(read(molfile));
        expect(fromMolfile[0]).toBe(true);
        const view = rdkitView(rd, molfile);
        expect(view.cx).toMatch(/\|\(.*\),w[UD]:\d+\.\d+\|$/);
        expect(axis(read(view.cx))).toEqual(fromMolfile);
        expect(relate(read(view.cx), read(molfile)).relation).toBe('identical');
        expect(view.label).toBe(fromMolfile[1]);
        seen.push(fromMolfile[1]!);
      }
      expect(new Set(seen)).toEqual(new Set(['M', 'P']));
    });
  }

  it('the drawing reflected in a line (y -> -y, same wedge) is the mirror image for both labellers', () => {
    const view = rdkitView(rd, wedgedMolfile(rd, BINOL, '1'));
    const flipped = view.cx.replace(
      /\((.*)\)/,
      (_, body: string) =>
        `(${body
          .split(';')
          .map((xyz) => {
            const [x, y, z] = xyz.split(',');
            return `${x},${y === '' ? '' : String(-Number(y))},${z ?? ''}`;
          })
          .join(';')})`,
    );
    const ours = axis(read(view.cx))[1];
    expect(axis(read(flipped))).toEqual([true, ours === 'M' ? 'P' : 'M']);
    expect(relate(read(view.cx), read(flipped)).relation).toBe('enantiomers');
    const m = rd.get_mol(flipped)!;
    const tags = JSON.parse((m as unknown as { get_stereo_tags(): string }).get_stereo_tags()) as {
      CIP_bonds: [number, number, string][];
    };
    m.delete();
    expect(tags.CIP_bonds[0]![2]).toBe(`(${ours === 'M' ? 'P' : 'M'})`);
  });

  it('with coordinates but no wedge the axis is undefined (the format could state it), as in a 2D molfile', () => {
    const m = rd.get_mol(BINOL)!;
    (m as unknown as { set_new_coords(): void }).set_new_coords();
    const cx = (m as unknown as { get_cxsmiles(): string }).get_cxsmiles();
    m.delete();
    expect(cx).toMatch(/ \|\(.*\)\|$/);
    const f = describe(read(cx));
    expect(f.units).toHaveLength(1);
    expect(f.units[0]!.defined).toBe(false);
    expect(f.units[0]!.formatCannotState).toBeUndefined();
  });

  it('without the coordinates block the axis stays open, with a remark naming the wedge and what is missing', () => {
    const view = rdkitView(rd, wedgedMolfile(rd, BINOL, '1'));
    const bare = view.cx.replace(/\|\(.*\),/, '|');
    expect(bare).toMatch(/ \|w[UD]:\d+\.\d+\|$/);
    const f = describe(read(bare));
    expect(f.units).toHaveLength(1);
    expect(f.units[0]).toMatchObject({
      kind: 'biaryl',
      defined: false,
      label: null,
      formatCannotState: true,
    });
    expect(f.chiral).toBeNull();
    expect(f.remarks.join('\n')).toMatch(
      /a wedge is written on the bond from atom \d+ to atom \d+, but without 2D coordinates a wedge fixes no configuration/,
    );
  });
});

suite('CXSMILES wedges elsewhere', () => {
  // (R)-butan-2-ol, C[C@@H](O)CC (from memory); the SMILES's @/@@ states the centre, a wedge on its bond does not
  // change it (common practice, no source: our rule, written in cxsmiles-drawing.ts).
  const coords = '(0,0,;1.5,0,;2,1,;3,0,;4,0,)';
  it.each([
    `C[C@@H](O)CC |${coords},wU:1.0|`,
    `C[C@@H](O)CC |${coords},wD:1.0|`,
    'C[C@@H](O)CC |wU:1.0|',
    `C[C@@H](O)CC |${coords}|`,
  ])('%s: a wedge on a stereocentre bond changes nothing', (text) => {
    const f = describe(read(text));
    expect(f.units.map((u) => [u.kind, u.atoms, u.label])).toEqual([['tetrahedral', [2], 'R']]);
    expect(f.remarks).toEqual([]);
  });
  it('3D coordinates are not read, and a warning says so', () => {
    const r = parseSmiles('C[C@@H](O)CC |(0,0,0;1.5,0,0.2;2,1,0;3,0,0;4,0,1)|');
    expect(r.ok && r.structure.dimension).toBe(0);
    expect(r.ok && r.warnings.map((w) => [w.code, w.at.offset])).toEqual([['cxsmiles-3d-coordinates', 14]]);
  });
  const bad: [string, string, number][] = [
    ['CC(O)C |wU:0.2|', 'cxsmiles-bad-wedge', 11],
    ['CC(O)C |wU:1.7|', 'cxsmiles-bad-wedge', 13],
    ['CC(O)C |wU:9.0|', 'cxsmiles-bad-wedge', 11],
    ['CC(O)C |wU:1.0,wD:1.0|', 'cxsmiles-bad-wedge', 18],
    ['CC(O)C |wU:1|', 'cxsmiles-bad-wedge', 12],
    ['CC(O)C |(0,0,;1,0,)|', 'cxsmiles-bad-coordinates', 8],
    ['CC(O)C |(0,0,;1,x,;2,0,;3,0,)|', 'cxsmiles-bad-coordinates', 14],
  ];
  it.each(bad)('%j -> %s at %i', (smi, code, offset) => {
    const r = parseSmiles(smi);
    expect(r.ok).toBe(false);
    if (!r.ok) expect([r.error.code, r.error.at.offset]).toEqual([code, offset]);
  });
});
