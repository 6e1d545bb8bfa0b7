/**
 * Element data and the implicit-hydrogen rule shared by every reader.
 *
 * Default valences follow the OpenSMILES specification's "organic subset" rule (B 3; C 4; N 3,5; O 2; P 3,5;
 * S 2,4,6; halogens 1): an atom gets the smallest listed valence that is >= its bond-order sum, and the
 * difference is filled with hydrogens. Molfiles use the same rule for atoms without an explicit H count.
 * Charges shift the valence as for the isoelectronic neighbour (N+ like C, O- like F, C- like N, B- like C).
 * The readers refuse a B, C, N, O, P, S, As, Se, Te or halogen atom above its highest valence (valenceProblem).
 */

export const ELEMENTS: readonly string[] = [
  '*',
  'H',
  'He',
  'Li',
  'Be',
  'B',
  'C',
  'N',
  'O',
  'F',
  'Ne',
  'Na',
  'Mg',
  'Al',
  'Si',
  'P',
  'S',
  'Cl',
  'Ar',
  'K',
  'Ca',
  'Sc',
  'Ti',
  'V',
  'Cr',
  'Mn',
  'Fe',
  'Co',
  'Ni',
  'Cu',
  'Zn',
  'Ga',
  'Ge',
  'As',
  'Se',
  'Br',
  'Kr',
  'Rb',
  'Sr',
  'Y',
  'Zr',
  'Nb',
  'Mo',
  'Tc',
  'Ru',
  'Rh',
  'Pd',
  'Ag',
  'Cd',
  'In',
  'Sn',
  'Sb',
  'Te',
  'I',
  'Xe',
  'Cs',
  'Ba',
  'La',
  'Ce',
  'Pr',
  'Nd',
  'Pm',
  'Sm',
  'Eu',
  'Gd',
  'Tb',
  'Dy',
  'Ho',
  'Er',
  'Tm',
  'Yb',
  'Lu',
  'Hf',
  'Ta',
  'W',
  'Re',
  'Os',
  'Ir',
  'Pt',
  'Au',
  'Hg',
  'Tl',
  'Pb',
  'Bi',
  'Po',
  'At',
  'Rn',
  'Fr',
  'Ra',
  'Ac',
  'Th',
  'Pa',
  'U',
  'Np',
  'Pu',
  'Am',
  'Cm',
  'Bk',
  'Cf',
  'Es',
  'Fm',
  'Md',
  'No',
  'Lr',
  'Rf',
  'Db',
  'Sg',
  'Bh',
  'Hs',
  'Mt',
  'Ds',
  'Rg',
  'Cn',
  'Nh',
  'Fl',
  'Mc',
  'Lv',
  'Ts',
  'Og',
];

const NUMBER_OF = new Map<string, number>(ELEMENTS.map((e, i) => [e, i]));

/** Atomic number of a symbol ('*' and unknown symbols give 0 / undefined respectively). */
export function atomicNumberOf(symbol: string): number | undefined {
  return NUMBER_OF.get(symbol);
}

/** Valence lists for elements that take implicit hydrogens, by atomic number. */
const DEFAULT_VALENCES: Record<number, readonly number[]> = {
  5: [3], // B
  6: [4], // C
  7: [3, 5], // N
  8: [2], // O
  9: [1], // F
  13: [3], // Al
  14: [4], // Si
  15: [3, 5], // P
  16: [2, 4, 6], // S
  17: [1], // Cl
  32: [4], // Ge
  33: [3, 5], // As
  34: [2, 4, 6], // Se
  35: [1], // Br
  52: [2, 4, 6], // Te
  53: [1, 3, 5], // I
};

/** Valence list for an element carrying a charge, via the isoelectronic element; empty = no implicit H. */
export function defaultValences(atomicNumber: number, charge: number): readonly number[] {
  if (charge === 0) return DEFAULT_VALENCES[atomicNumber] ?? [];
  // Main-group only: shift to the isoelectronic element in the same period.
  const group = mainGroup(atomicNumber);
  if (group === null) return [];
  // A positive charge on N (group 15) behaves like C (group 14); a negative charge on O like F (group 17)...
  // except for groups 13/14 where a positive charge removes a bond (C+ has valence 3, B- valence 4).
  const shifted = group - charge;
  if (group >= 15 && charge > 0) {
    // N+, O+, S+, P+ -> valence of the element one group to the left (N+ 4, O+ 3, S+ 3/5)
    const v = groupValences(shifted, atomicNumber);
    return v;
  }
  if (charge < 0) {
    if (group <= 14) {
      // B- 4, C- 3, Si- 3
      return group === 13 ? [4] : [3];
    }
    return groupValences(shifted, atomicNumber);
  }
  // C+ 3, B+ 2
  return group === 14 ? [3] : group === 13 ? [2] : [];
}

function mainGroup(z: number): number | null {
  const table: Record<number, number> = {
    5: 13,
    6: 14,
    7: 15,
    8: 16,
    9: 17,
    13: 13,
    14: 14,
    15: 15,
    16: 16,
    17: 17,
    32: 14,
    33: 15,
    34: 16,
    35: 17,
    52: 16,
    53: 17,
  };
  return table[z] ?? null;
}

function groupValences(group: number, z: number): readonly number[] {
  const period2 = z <= 9;
  switch (group) {
    case 14:
      return [4];
    case 15:
      return period2 ? [3] : [3, 5];
    case 16:
      return period2 ? [2] : [2, 4, 6];
    case 17:
      return [1];
    case 18:
      return [0];
    default:
      return [];
  }
}

/**
 * Implicit hydrogens for an atom that does not state its own H count.
 * @param bondOrderSum sum of bond orders to explicit atoms (Kekulé), plus 1 for an aromatic atom written as
 *   aromatic without a Kekulé assignment (the reader's responsibility).
 * @param radical unpaired electrons (each takes the place of one hydrogen).
 */
export function implicitHydrogens(
  atomicNumber: number,
  charge: number,
  bondOrderSum: number,
  radical = 0,
): number {
  const valences = defaultValences(atomicNumber, charge);
  const used = bondOrderSum + radical;
  for (const v of valences) if (v >= used) return v - used;
  return 0;
}

/** Elements whose valence the readers check (B, C, N, O, P, S, halogens, As, Se, Te); others are not checked. */
const CHECKED: Record<number, string> = {
  5: 'boron',
  6: 'carbon',
  7: 'nitrogen',
  8: 'oxygen',
  9: 'fluorine',
  15: 'phosphorus',
  16: 'sulfur',
  17: 'chlorine',
  33: 'arsenic',
  34: 'selenium',
  35: 'bromine',
  52: 'tellurium',
  53: 'iodine',
};

/**
 * Largest valence (bond-order sum + hydrogens) an atom may have, or null when the element is not checked
 * (metals, Si, noble gases, wildcards) or its charge leaves no listed valence. Uses `defaultValences`, so the
 * charge is taken into account (N+ 4, O+ 3, C+ and C- 3, B- 4) and S, P, I, Se, As, Te may be hypervalent.
 */
export function maxValence(atomicNumber: number, charge: number): number | null {
  if (CHECKED[atomicNumber] === undefined) return null;
  const vals = defaultValences(atomicNumber, charge);
  if (vals.length === 0) return null;
  return Math.max(...vals);
}

/**
 * Plain-words complaint when `bondOrderSum + hCount` exceeds `maxValence`, else null, e.g.
 * "carbon with 6 bonds (at most 4)"; hydrogens and charge are named when present.
 * @param oxoBonds double bonds from this atom to oxygen. A neutral Cl, Br or I written with X=O bonds (HClO4 as
 *   `OCl(=O)(=O)=O`) is read as the charge-separated form X+–O- for each of them ([Cl+3] with four single
 *   bonds), as RDKit reads it; only if that fails too is it refused.
 */
export function valenceProblem(
  atomicNumber: number,
  charge: number,
  bondOrderSum: number,
  hCount: number,
  oxoBonds = 0,
  multipleBonds?: number,
  metalBonds = 0,
): string | null {
  const max = maxValence(atomicNumber, charge);
  const used = bondOrderSum + hCount;
  if (atomicNumber === 7 && charge === 0) {
    const n = nitrogenProblem(used, hCount, multipleBonds, metalBonds);
    if (n !== null) return n;
  }
  if (max === null || used <= max) return null;
  if (charge === 0 && oxoBonds > 0 && (atomicNumber === 17 || atomicNumber === 35 || atomicNumber === 53)) {
    const sep = maxValence(atomicNumber, oxoBonds);
    if (sep !== null && used - oxoBonds <= sep) return null;
  }
  const name = CHECKED[atomicNumber]!;
  const ch = charge === 0 ? '' : ` of charge ${charge > 0 ? '+' : ''}${charge}`;
  const hs = hCount > 0 ? `, ${hCount} of them to hydrogen` : '';
  return `${name}${ch} with ${used} bonds${hs} (at most ${max})`;
}

/**
 * A neutral nitrogen has valence 3, or 5 in the pentavalent forms drawn with a double or triple bond (nitro
 * N(=O)=O, N-oxide R3N=O, as OpenSMILES's organic subset lists them). A bond to a metal may be a coordination
 * drawn as a single bond (ammine [NH3][Pt], an imidazole N on cobalt), so it is not counted against the 3.
 * Four bonds (`CN(C)(C)C`, `C=N(C)C`), or five single bonds (`[NH4]` on a metal: four besides the metal bond)
 * need a positive charge: common practice, no source (RDKit refuses them too).
 * `multipleBonds` undefined: the caller does not know, the five-bond rule is skipped.
 */
function nitrogenProblem(
  used: number,
  hCount: number,
  multipleBonds: number | undefined,
  metalBonds: number,
): string | null {
  if (used === 3 || (used === 5 && multipleBonds !== 0) || used < 3) return null;
  const own = used - metalBonds;
  if (metalBonds > 0 && own <= 3) return null;
  const hs = hCount > 0 ? `, ${hCount} of them to hydrogen` : '';
  const besides = metalBonds > 0 ? ` besides ${metalBonds === 1 ? 'its bond' : 'its bonds'} to a metal` : '';
  if (own === 4 || (own === 5 && multipleBonds === 0) || own > 5) {
    return (
      `neutral nitrogen with ${own} bonds${hs}${besides} (a neutral N has 3, or 5 only with a double bond as in ` +
      'N(=O)=O; an ammonium N with 4 carries a + charge: [N+], [NH4+])'
    );
  }
  return null;
}

/**
 * Metals: every element but hydrogen, the noble gases, the non-metals and the metalloids B, Si, As and Te
 * (a bond from N to one of these is an ordinary covalent bond). Germanium, antimony and the heavier elements count
 * as metals here, as coordination partners.
 */
const NOT_METAL = new Set([
  0, 1, 2, 5, 6, 7, 8, 9, 10, 14, 15, 16, 17, 18, 33, 34, 35, 36, 52, 53, 54, 85, 86,
]);

export function isMetal(atomicNumber: number): boolean {
  return !NOT_METAL.has(atomicNumber);
}
