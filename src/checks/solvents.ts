/**
 * Solvent names as registries spell them, folded to one name, so that two rotations measured in `CHCl3` and in
 * `chloroform` count as measured in the same solvent. The table holds the common laboratory solvents of optical
 * rotation work under their names, formulas and abbreviations: common practice, no source (the names and
 * formulas are the ordinary ones; the abbreviations are those in everyday use in experimental sections).
 * Deuterated solvents are kept apart from their protio forms (CDCl3 is not CHCl3). A solvent outside the table
 * is compared by its text (case, spaces and subscript digits ignored) and said to be unknown when that differs.
 */
import type { Rotation } from '../registry/types.js';

const TABLE: Record<string, readonly string[]> = {
  water: ['water', 'h2o'],
  methanol: ['methanol', 'meoh', 'ch3oh', 'methyl alcohol'],
  ethanol: ['ethanol', 'etoh', 'c2h5oh', 'ch3ch2oh', 'ethyl alcohol'],
  'propan-2-ol': ['propan-2-ol', '2-propanol', 'isopropanol', 'isopropyl alcohol', 'ipa', 'iproh', 'i-proh'],
  chloroform: ['chloroform', 'chcl3', 'trichloromethane'],
  'chloroform-d': ['chloroform-d', 'cdcl3', 'deuterochloroform'],
  dichloromethane: ['dichloromethane', 'dcm', 'ch2cl2', 'methylene chloride'],
  'carbon tetrachloride': ['carbon tetrachloride', 'ccl4', 'tetrachloromethane'],
  acetone: ['acetone', 'propan-2-one', 'propanone', '(ch3)2co', 'me2co'],
  acetonitrile: ['acetonitrile', 'mecn', 'ch3cn'],
  'dimethyl sulfoxide': ['dimethyl sulfoxide', 'dimethyl sulphoxide', 'dmso', '(ch3)2so', 'me2so'],
  'N,N-dimethylformamide': ['n,n-dimethylformamide', 'dimethylformamide', 'dmf'],
  tetrahydrofuran: ['tetrahydrofuran', 'thf', 'oxolane'],
  'ethyl acetate': ['ethyl acetate', 'etoac', 'acoet'],
  'diethyl ether': ['diethyl ether', 'ether', 'et2o', 'ethoxyethane'],
  benzene: ['benzene', 'c6h6'],
  toluene: ['toluene', 'phme', 'methylbenzene', 'c6h5ch3'],
  hexane: ['hexane', 'n-hexane'],
  pyridine: ['pyridine', 'c5h5n'],
  'acetic acid': ['acetic acid', 'acoh', 'hoac', 'ch3cooh', 'ch3co2h', 'ethanoic acid'],
  '1,4-dioxane': ['1,4-dioxane', 'dioxane'],
  neat: ['neat', 'no solvent', 'none'],
};

const BY_SPELLING = new Map<string, string>();
for (const [name, spellings] of Object.entries(TABLE)) for (const s of spellings) BY_SPELLING.set(s, name);

const SUBSCRIPTS = '₀₁₂₃₄₅₆₇₈₉';

/** Lower case, subscript digits as digits, spaces collapsed. */
export function solventText(s: string): string {
  let out = '';
  for (const ch of s.trim().toLowerCase()) {
    const k = SUBSCRIPTS.indexOf(ch);
    out += k >= 0 ? String(k) : ch;
  }
  return out.replace(/\s+/g, ' ');
}

/** The solvent's name from the table, or null when the table does not know the spelling. */
export function solventName(s: string): string | null {
  return BY_SPELLING.get(solventText(s)) ?? null;
}

/** same: one solvent; different: two known solvents; unknown: texts differ and the table cannot tell. */
export function compareSolvents(a: string, b: string): 'same' | 'different' | 'unknown' {
  if (solventText(a) === solventText(b)) return 'same';
  const x = solventName(a);
  const y = solventName(b);
  if (x !== null && y !== null) return x === y ? 'same' : 'different';
  return 'unknown';
}

export type Comparability = { alike: true } | { alike: false; reason: string };

/**
 * Whether two specific rotations were measured alike, so their signs and sizes can be compared: the same
 * wavelength (missing = 589 nm, the sodium D line), the same solvent (see the table), temperatures within 5 °C
 * (common practice, no source). When not, the reason in words, to be read after "they were".
 */
export function rotationsComparable(a: Rotation, b: Rotation): Comparability {
  const nm = (r: Rotation): number => r.wavelength_nm ?? 589;
  if (Math.abs(nm(a) - nm(b)) > 1) {
    return { alike: false, reason: `measured at different wavelengths (${nm(a)} nm and ${nm(b)} nm)` };
  }
  const sa = a.solvent?.trim() ?? '';
  const sb = b.solvent?.trim() ?? '';
  if ((sa === '') !== (sb === '')) {
    return { alike: false, reason: `measured with the solvent given for one of them only ('${sa || sb}')` };
  }
  if (sa !== '') {
    const c = compareSolvents(sa, sb);
    if (c === 'different')
      return { alike: false, reason: `measured in different solvents (${sa} and ${sb})` };
    if (c === 'unknown') {
      return {
        alike: false,
        reason:
          `measured in '${sa}' and '${sb}', which stereogate cannot tell to be the same solvent (not in its ` +
          'table of solvent names)',
      };
    }
  }
  if (
    a.temperature_c !== undefined &&
    b.temperature_c !== undefined &&
    Math.abs(a.temperature_c - b.temperature_c) > 5
  ) {
    return {
      alike: false,
      reason: `measured more than 5 °C apart (${a.temperature_c} °C and ${b.temperature_c} °C)`,
    };
  }
  return { alike: true };
}
