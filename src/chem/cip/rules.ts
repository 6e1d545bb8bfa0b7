/**
 * The sequence rules of P-92.2 to P-92.6 (IUPAC 2013; section numbers from memory), as revised and ordered for machine use by Hanson et al. 2018
 * (J. Chem. Inf. Model. 58, 1755-1765). Each rule but 4b gives every digraph node a number; comparing two
 * branches under a rule means comparing these numbers sphere by sphere (compare.ts). Rule 4b compares whole
 * branches (like/unlike descriptor pairs) and lives in rule4b.ts.
 */
import type { CipLabel } from '../facts.js';
import type { CipNode } from './digraph.js';

export const RULE_NAMES = ['1a', '1b', '2', '3', '4a', '4b', '4c', '5', '6'] as const;
export type RuleName = (typeof RULE_NAMES)[number];

export const RULE_1A = 0;
export const RULE_1B = 1;
export const RULE_2 = 2;
export const RULE_3 = 3;
export const RULE_4A = 4;
export const RULE_4B = 5;
export const RULE_4C = 6;
export const RULE_5 = 7;
export const RULE_6 = 8;

/** Rule 1a (P-92.2.1.1, Rule 1a): higher atomic number precedes lower; duplicates carry the duplicated atom's. */
export function rule1a(n: CipNode): number {
  return n.z;
}

/**
 * Rule 1b (P-92.2.1.2 as revised by Hanson et al. 2018): a duplicate atom node whose corresponding
 * non-duplicated node is the root or closer to the root ranks higher than one whose corresponding node is
 * farther from the root.
 */
export function rule1b(n: CipNode): number {
  return -n.dist;
}

/** Rule 2 (P-92.3, Rule 2): higher atomic mass number precedes lower; a duplicate has its atom's mass (Digraph.massOf). */
export function rule2(mass: number): number {
  return mass;
}

/**
 * Rule 3 (P-92.4, Rule 3): seqcis ('Z') precedes seqtrans ('E'), which precedes a non-stereogenic bond. A bond
 * whose own ranking rests on Rule 5 ('z'/'e') counts only as pseudoasymmetric unit (Rule 4a), as the suite's VS214
 * requires.
 */
export function rule3(label: CipLabel | null): number {
  return label === 'Z' ? 2 : label === 'E' ? 1 : 0;
}

/**
 * Rule 4a (P-92.5.1, Rule 4a): chiral stereogenic units precede pseudoasymmetric ones, which precede
 * non-stereogenic ones.
 */
export function rule4a(label: CipLabel | null): number {
  if (label === null) return 0;
  return label === 'R' || label === 'S' || label === 'M' || label === 'P' ? 2 : 1;
}

/** Rule 4c (P-92.5.3, Rule 4c): 'r' precedes 's' and 'm' precedes 'p'. */
export function rule4c(label: CipLabel | null): number {
  return label === 'r' || label === 'm' ? 2 : label === 's' || label === 'p' ? 1 : 0;
}

/**
 * Rule 5 (P-92.6, Rule 5): 'R' precedes 'S', 'M' precedes 'P', seqcis precedes seqtrans for a double bond
 * whose own ranking rests on Rule 5 ('z' before 'e'; these invert on reflection like R and S).
 */
export function rule5(label: CipLabel | null): number {
  return label === 'R' || label === 'M' || label === 'z'
    ? 2
    : label === 'S' || label === 'P' || label === 'e'
      ? 1
      : 0;
}

/** Proposed Rule 6 (Hanson et al. 2018): an undifferentiated reference node has priority over any other. */
export function rule6(n: CipNode, ref: number): number {
  return n.atom === ref ? 1 : 0;
}

/** Descriptor class for like/unlike pairing (P-92.5.2, Rule 4b): R, M and r, m are "like" each other. */
export function likeClass(label: CipLabel): number {
  return label === 'R' || label === 'M' || label === 'r' || label === 'm'
    ? 1
    : label === 'S' || label === 'P' || label === 's' || label === 'p'
      ? 2
      : 0;
}

export function isChiralLabel(label: CipLabel | null): boolean {
  return label === 'R' || label === 'S' || label === 'M' || label === 'P';
}
