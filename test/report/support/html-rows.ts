/**
 * Rows of the HTML report for the browser tests: real structures (textbook molecules, structures from memory)
 * described by our engine and laid out by chem/depict.ts, with invented Larkspur Chemistry Lab claims.
 */
import { readFileSync } from 'node:fs';
import { describe as describeStructure, readStructure } from '../../../src/chem/index.js';
import { layoutStructure } from '../../../src/chem/depict.js';
import { pictureData, type PicData } from '../../../src/report/html/picture.js';
import type { HtmlRow } from '../../../src/report/html/render.js';

export interface Sample {
  id: string;
  structure: string;
  form: string;
  word: string | null;
  check: string;
  severity: 'error' | 'warning' | 'note';
}

export const SAMPLES: Sample[] = [
  // (R)-butan-2-ol declared (S)
  {
    id: 'LX-00001',
    structure: 'C[C@@H](O)CC',
    form: 'single-enantiomer',
    word: 'abs',
    check: 'descriptors-match-structure',
    severity: 'error',
  },
  // meso-tartaric acid declared racemate
  {
    id: 'LX-00002',
    structure: 'OC(=O)[C@@H](O)[C@@H](O)C(=O)O',
    form: 'racemate',
    word: 'RAC',
    check: 'form-matches-structure',
    severity: 'error',
  },
  // 2,3-dibromobutane with both centres undefined, declared single enantiomer
  {
    id: 'LX-00003',
    structure: 'CC(Br)C(Br)C',
    form: 'single-enantiomer',
    word: null,
    check: 'form-matches-structure',
    severity: 'warning',
  },
  // (E)-but-2-enoic acid (crotonic acid)
  {
    id: 'LX-00004',
    structure: 'C/C=C/C(=O)O',
    form: 'achiral',
    word: 'achiral',
    check: 'descriptors-match-structure',
    severity: 'note',
  },
  // L-alanine zwitterion
  {
    id: 'LX-00005',
    structure: 'C[C@H]([NH3+])C(=O)[O-]',
    form: 'racemate',
    word: 'dl',
    check: 'form-matches-structure',
    severity: 'error',
  },
  // rac-ibuprofen as its registered molfile (V3000, own coordinates)
  {
    id: 'LX-00009',
    structure: readFileSync('fixtures/demo-registry/compounds/LX-00009.mol', 'utf8'),
    form: 'racemate',
    word: null,
    check: 'enhanced-stereo-matches-form',
    severity: 'warning',
  },
  // (-)-menthol-like trisubstituted cyclohexane
  {
    id: 'LX-00012',
    structure: 'CC(C)[C@@H]1CC[C@@H](C)C[C@H]1O',
    form: 'single-enantiomer',
    word: 'single enantiomer',
    check: 'rotation-consistent',
    severity: 'error',
  },
];

export function sampleRow(s: Sample, seq = 0): HtmlRow & { pic: PicData | null } {
  const read = readStructure(s.structure, { format: s.structure.includes('\n') ? 'molfile' : 'smiles' });
  if (!read.ok) throw new Error(`sample ${s.id} does not read: ${read.error.message}`);
  const facts = describeStructure(read.structure);
  const layout = layoutStructure(read.structure);
  const name = (u: (typeof facts.units)[number]) =>
    u.atoms.length === 1 ? `${u.element}${u.atoms[0]}` : u.atoms.join('=');
  return {
    id: seq ? `${s.id.slice(0, 3)}${String(seq).padStart(5, '0')}` : s.id,
    file: `larkspur-export.sdf · record ${seq || 1}, line ${(seq || 1) * 40}`,
    form: s.form,
    word: s.word,
    descriptors: '',
    computed: `${facts.chiral === null ? 'chirality open' : facts.chiral ? 'chiral' : 'achiral'}; ${facts.units.length} stereo units, ${facts.undefined} undefined`,
    labels: facts.units
      .filter((u) => u.label)
      .map((u) => `${name(u)} ${u.label}`)
      .join(', '),
    undef: facts.units
      .filter((u) => !u.defined)
      .map(name)
      .join(', '),
    worst: s.severity,
    findings: [
      {
        check: s.check,
        severity: s.severity,
        message: `Declared ${s.form}; see the structure.`,
        line: 7,
        waived: null,
      },
    ],
    pic: layout ? pictureData(layout, facts.units) : null,
  };
}
