/** Hand-written molfiles shared by the molfile tests (layout per the CTfile format specification). */
import type { ReadResult, Structure } from '../../../src/chem/types.js';

export function ok(r: ReadResult): Structure {
  if (!r.ok) throw new Error(`${r.error.code} at line ${r.error.at.line}: ${r.error.message}`);
  return r.structure;
}

/** Ethanol drawn by hand in V2000 (three header lines, counts line on line 4), `id` on its name line; lines. */
export function ethanolV2000(id: string): string[] {
  return [
    id,
    '  stereogate',
    '',
    '  3  2  0  0  0  0  0  0  0  0999 V2000',
    '    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
    '    1.2990    0.7500    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
    '    2.5981    0.0000    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0',
    '  1  2  1  0',
    '  2  3  1  0',
    'M  END',
  ];
}

// CTfile spec alanine example (charges by M  CHG, 13C by M  ISO, wedge 1->3, chiral flag set).
export const ALANINE_V2000 = `L-Alanine (13C)
  -ISIS-  01119511002D

  6  5  0  0  1  0              3 V2000
   -0.6622    0.5342    0.0000 C   0  0  2  0  0  0
    0.6220   -0.3000    0.0000 C   0  0  0  0  0  0
   -0.7207    2.0817    0.0000 C   1  0  0  0  0  0
   -1.8622   -0.3695    0.0000 N   0  3  0  0  0  0
    0.6220   -1.8037    0.0000 O   0  0  0  0  0  0
    1.9464    0.4244    0.0000 O   0  5  0  0  0  0
  1  2  1  0  0  0
  1  3  1  1  0  0
  1  4  1  0  0  0
  2  5  2  0  0  0
  2  6  1  0  0  0
M  CHG  2   4   1   6  -1
M  ISO  1   3  13
M  END
`;
