/** Printed once in every comment and report. */
export const CAUTION =
  'Computed result: stereogate derives these findings from the drawn structure by algorithm. The responsible ' +
  'chemist must confirm every finding before registration; a computed result is no substitute for analytical ' +
  'evidence (chiral chromatography, optical rotation, X-ray, NMR), and your local SOPs decide.';
