/**
 * describe(): a structure in, every stereo fact the engine knows out (facts.ts StructureFacts). Atom numbers in
 * the facts are the 1-based input numbers.
 */
import type {
  CipLabel,
  ComponentFacts,
  EnhancedStereoFacts,
  StereoUnitFact,
  StructureFacts,
} from '../facts.js';
import { constitutionKey, molecularFormula } from '../graph/index.js';
import { countStereoisomers, countValue } from '../isomers/index.js';
import { labelUnits } from '../labels.js';
import { extractAtoms } from '../normalize.js';
import type { State } from '../perceive/index.js';
import type { UnitGroup } from '../symmetry/index.js';
import type { Structure } from '../types.js';
import { writeSmiles } from '../write/smiles.js';
import { analyse, parentComponent, type Analysis } from './analyse.js';
import { parentCopies, withoutCopies } from './copies.js';
import { drawnMixture } from './mixture.js';
import { mirrorFacts } from './evidence.js';
import { listStereoisomers } from './isomer-list.js';

export interface DescribeOptions {
  listIsomers?: boolean;
  maxIsomers?: number;
  /** Minimum ortho substituents for a potential biaryl axis (perceive/axes.ts; rule of thumb, default 3). */
  axisOrthoMin?: number;
}

const unitKey = (atoms: number[]): string => [...atoms].sort((a, b) => a - b).join(',');

export function describe(input: Structure, opts: DescribeOptions = {}): StructureFacts {
  const perceiveOpts = opts.axisOrthoMin === undefined ? {} : { axisOrthoMin: opts.axisOrthoMin };
  const a = analyse(input, perceiveOpts);
  const { p } = a;
  const s = p.structure;
  const labels = new Map<string, CipLabel>();
  let stoppedLabels = 0;
  if (s.stereo.length > 0) {
    for (const r of labelUnits(s)) {
      if (r.label) labels.set(unitKey(r.atoms), r.label);
      else if (r.stopped) stoppedLabels++;
    }
  }

  const units = unitFacts(a, labels);
  // A 2:1 salt holds two copies of one stereoisomer: count and judge chirality on one copy.
  const comps = p.components;
  const parentIndex = parentComponent(s, comps);
  const copies = parentCopies(s, comps, parentIndex);
  // Several stereoisomers of the parent drawn as separate molecules (a racemate drawn out): see mixture.ts.
  const mixture = drawnMixture(s, comps, parentIndex, copies);
  const dropped = mixture ? mixture.beyondParent : copies;
  const counted = dropped.length > 0 ? analyse(withoutCopies(s, comps, dropped), perceiveOpts) : a;
  const stereoisomers = countStereoisomers(counted.group, counted.p.units.length);
  if (!counted.group.complete) stereoisomers.open = true;
  const drawnChiral = mixture
    ? mixture.chiral.some((c) => c === true)
      ? true
      : mixture.chiral.every((c) => c === false)
        ? false
        : null
    : counted.chirality.chiral;
  // Biaryl axes SMILES cannot state, found by a rule of thumb: whether the substance is chiral at all (is the
  // rotation hindered?) and which stereoisomer it is are open. A helix or a planar unit is certain: its
  // chirality follows from the drawing like any undefined unit's.
  const unstatable = units.filter((u) => u.formatCannotState);
  const openAxes = unstatable.filter((u) => u.kind === 'biaryl');
  const chiral = openAxes.length > 0 ? null : drawnChiral;
  // Gold Book meso: achiral member of a set with chiral members (so the count must hold a meso form too).
  const meso =
    chiral === null
      ? null
      : chiral === false && countValue(stereoisomers.chiral) > 0n && countValue(stereoisomers.meso) > 0n;
  const components = componentFacts(a, parentIndex, copies, mixture ? mixture.beyondParent : copies);
  const facts: StructureFacts = {
    stereocenters: units
      .filter((u) => u.kind === 'tetrahedral')
      .map((u) => ({ atom: u.atoms[0], label: u.label, element: u.element, defined: u.defined })),
    stereobonds: units
      .filter((u) => u.kind !== 'tetrahedral')
      .map((u) => ({
        atoms: [u.atoms[0], u.atoms[1]] as [number, number],
        label: u.label,
        kind: u.kind,
        defined: u.defined,
      })),
    units,
    chiral,
    meso,
    undefined: units.filter((u) => !u.defined).length,
    stereoisomers,
    mirror: mirrorFacts(counted),
    enhanced: enhancedFacts(a),
    invertibleNitrogens: p.invertibleNitrogens.map((i) => ({
      atom: s.atoms[i].inputNumber,
      drawnWithStereo: true,
    })),
    components,
    constitutionKey: constitutionKey(s),
    formula: components.length === 1 ? components[0].formula : molecularFormula(s),
    remarks: p.remarks.slice(),
  };
  for (const u of unstatable) {
    facts.remarks.push(unstatedRemark(u, s));
  }
  if (openAxes.length > 0) {
    facts.mirror = {
      chiral: null,
      fixedAtoms: [],
      fixedBonds: [],
      explanation: 'open: the input does not state the configuration of a stereogenic axis',
    };
  }
  if (stoppedLabels > 0) {
    facts.remarks.push(
      `CIP labelling stopped at its work limit for one structure: ${stoppedLabels === 1 ? '1 drawn stereo unit was' : `${stoppedLabels} drawn stereo units were`} left without a descriptor (open, not a finding that none applies)`,
    );
  }
  if (mixture) {
    facts.mixture = mixture.facts;
    facts.remarks.push(
      `${mixture.facts.explanation}: a mixture, not one molecule, so stereoisomer counts are those of one molecule and "meso" does not apply to the drawing`,
    );
    if (chiral === true) {
      facts.mirror = {
        chiral: true,
        fixedAtoms: [],
        fixedBonds: [],
        explanation: `chiral molecules: ${mixture.facts.explanation}`,
      };
    }
    if (facts.enhanced.meaning === 'absolute' || facts.enhanced.meaning === 'none')
      facts.enhanced.meaning = mixture.facts.kind === 'racemate' ? 'racemic' : 'mixture';
  } else if (copies.length > 0) {
    facts.remarks.push(
      `${copies.length + 1} identical copies of the parent (${components[parentIndex].formula}): stereoisomer counts and chirality are those of one copy`,
    );
  }
  if (p.invertibleNitrogens.length > 0 && units.length === 0) {
    facts.remarks.push(
      'the only configuration drawn is on an invertible amine nitrogen: the structure has no stereocentre',
    );
  }
  if (opts.listIsomers) facts.stereoisomerList = listStereoisomers(a, opts.maxIsomers ?? 64);
  return facts;
}

function unitFacts(a: Analysis, labels: Map<string, CipLabel>): StereoUnitFact[] {
  const { p, group, state } = a;
  const s = p.structure;
  const classIds = new Map<string, number>();
  const groupOf = new Map<number, { type: 'abs' | 'and' | 'or'; id: number }>();
  for (const g of s.groups) for (const x of g.atoms) groupOf.set(x, { type: g.type, id: g.id });
  const fullyDefined = a.defined.every((d) => d === 1);
  const out: StereoUnitFact[] = [];
  p.units.forEach((u, k) => {
    if (!a.reported[k]) return;
    const ck =
      u.atoms
        .map((x) => p.classes[x])
        .sort((x, y) => x - y)
        .join(',') + u.kind;
    if (!classIds.has(ck)) classIds.set(ck, classIds.size);
    // a helix is labelled from the sense the drawing gives it (perceive: bit 0 = P)
    const label =
      !u.defined || u.kind === 'planar'
        ? null
        : u.kind === 'helix'
          ? u.bit === 0
            ? 'P'
            : 'M'
          : (labels.get(unitKey(u.atoms)) ?? null);
    let pseudo = label !== null && label === label.toLowerCase();
    if (fullyDefined && u.mode === 'parity' && !pseudo) {
      // reflection-invariant: an improper symmetry maps the unit onto itself (P-93.5.1.3, pseudoasymmetry)
      pseudo = group.perms.some((perm, h) => perm[k] === k && mirrorFixed(group, h, state));
    }
    out.push({
      kind: u.kind,
      atoms: u.atoms.map((x) => s.atoms[x].inputNumber),
      element: s.atoms[u.atoms[0]].element,
      defined: u.defined,
      label,
      pseudoasymmetric: pseudo,
      locants: u.atoms.map((x) => s.atoms[x].mapNumber),
      group: groupOf.get(u.atoms[0]) ?? null,
      equivalenceClass: classIds.get(ck)!,
      classKey: ck,
      component: p.componentOfAtom[u.atoms[0]],
      ...(!u.defined && cannotState(u.kind, s.dimension)
        ? {
            formatCannotState: true as const,
            openBecause: unstatedReason(
              u.kind,
              u.atoms.map((x) => s.atoms[x].inputNumber),
              s,
            ),
          }
        : {}),
    });
  });
  return out;
}

/** SMILES cannot state an axis, a helix or a planar twist; a 2D molfile cannot state a planar twist either. */
function cannotState(kind: StereoUnitFact['kind'], dimension: number): boolean {
  if (kind === 'planar') return dimension !== 3;
  return dimension === 0 && (kind === 'biaryl' || kind === 'helix');
}

/**
 * Why the input leaves a unit it cannot state open, in a few words ("open (…)" in describe's text, and the remark):
 * a SMILES has no notation for an axis, a helix or a planar twist; a wedge on an axis needs 2D coordinates; 2D
 * coordinates cannot state a planar twist.
 */
function unstatedReason(kind: StereoUnitFact['kind'], atoms: number[], s: Structure): string {
  if (kind === 'planar' && s.dimension === 2) return '2D coordinates cannot state its configuration';
  if (kind === 'biaryl') {
    if (wedgeNearAxis(s, atoms[0], atoms[1]) !== null)
      return 'a wedge without 2D coordinates fixes no configuration';
    return 'a SMILES without 2D coordinates and wedges cannot state its configuration';
  }
  return 'a SMILES cannot state its configuration';
}

function unstatedRemark(u: StereoUnitFact, s: Structure): string {
  const [x, y] = u.atoms;
  const what =
    u.kind === 'biaryl'
      ? `the bond between atoms ${x} and ${y} is a potential stereogenic axis (ortho-substituted biaryl, found by a rule of thumb on ortho substitution: common practice, no source)`
      : u.kind === 'helix'
        ? `the ortho-fused rings ending at atoms ${x} and ${y} form a helix`
        : `the trans double bond between atoms ${x} and ${y} lies in a ring of 8–11 atoms and is twisted (planar chiral, as (E)-cyclooctene)`;
  if (u.kind === 'biaryl') {
    const wedge = wedgeNearAxis(s, x, y);
    if (wedge !== null)
      return `${what}; a wedge is written on the bond from atom ${wedge[0]} to atom ${wedge[1]}, but without 2D coordinates a wedge fixes no configuration (the same SMILES and wedge drawn reflected in a line are the mirror image): chirality is left open (give the CXSMILES its coordinates block, or a molfile with wedges)`;
  }
  const then =
    u.kind === 'biaryl'
      ? 'chirality is left open (a molfile with wedges or 3D coordinates, or a CXSMILES with 2D coordinates and wedges, states it)'
      : 'which of its two enantiomeric forms is meant is open (3D coordinates state it)';
  return `${what}; ${u.openBecause ?? 'the input cannot state its configuration'}: ${then}`;
}

/**
 * A wedge or hash (a CXSMILES `wU:`/`wD:`) starting at an axis atom (input numbers x, y) or at one of their
 * neighbours, as [narrow end, wide end] in input numbers; null when there is none.
 */
function wedgeNearAxis(s: Structure, x: number, y: number): [number, number] | null {
  const near = new Set<number>();
  for (const b of s.bonds) {
    const na = s.atoms[b.a].inputNumber;
    const nb = s.atoms[b.b].inputNumber;
    if (na === x || na === y) near.add(b.b);
    if (nb === x || nb === y) near.add(b.a);
  }
  for (const b of s.bonds) {
    if (b.wedge !== 'up' && b.wedge !== 'down') continue;
    const na = s.atoms[b.a].inputNumber;
    if (na === x || na === y || near.has(b.a)) return [na, s.atoms[b.b].inputNumber];
  }
  return null;
}

/** (σ_h · M)(x) = x ? */
function mirrorFixed(g: UnitGroup, h: number, x: State): boolean {
  const perm = g.perms[h];
  const flip = g.flips[h];
  for (let i = 0; i < x.length; i++) {
    if ((x[i] ^ flip[i] ^ g.reflect[i]) === x[perm[i]]) continue;
    // an absent planar unit (its host ring-cis) holds 0 whatever the symmetry does to it
    if (i < g.planarHost.length && g.planarHost[i] >= 0 && x[g.planarHost[i]] === g.planarZ[i]) continue;
    return false;
  }
  return true;
}

function enhancedFacts(a: Analysis): EnhancedStereoFacts {
  const s = a.p.structure;
  const groups = s.groups.map((g) => ({
    type: g.type,
    id: g.id,
    atoms: g.atoms.map((x) => s.atoms[x].inputNumber),
  }));
  const definedParity = a.p.units.filter((u, k) => u.defined && u.mode === 'parity' && a.reported[k]);
  if (definedParity.length === 0 && !a.p.units.some((u) => u.defined)) return { groups, meaning: 'none' };
  if (definedParity.length === 0) return { groups, meaning: 'absolute' };
  const member = new Map<number, string>();
  for (const g of s.groups)
    for (const x of g.atoms) member.set(x, g.type === 'abs' ? 'abs' : `${g.type}${g.id}`);
  const kinds = new Set(definedParity.map((u) => member.get(u.atoms[0]) ?? 'abs'));
  if (s.groups.length === 0) return { groups, meaning: s.chiralFlag === false ? 'relative' : 'absolute' };
  const list = [...kinds];
  if (list.length === 1 && list[0] === 'abs') return { groups, meaning: 'absolute' };
  if (list.length === 1 && list[0].startsWith('and')) return { groups, meaning: 'racemic' };
  if (list.length === 1 && list[0].startsWith('or')) return { groups, meaning: 'relative' };
  if (list.every((k) => k.startsWith('and'))) return { groups, meaning: 'mixture' };
  return { groups, meaning: 'mixed' };
}

/** `copies`: identical copies of the parent; `ofParent`: every other molecule of its constitution (mixtures). */
function componentFacts(a: Analysis, parent: number, copies: number[], ofParent: number[]): ComponentFacts[] {
  const s = a.p.structure;
  const comps = a.p.components;
  const single = comps.length === 1;
  return comps.map((c, k) => {
    const f = {
      index: k,
      formula: single ? molecularFormula(s) : molecularFormula(s, c),
      heavyAtoms: c.filter((x) => s.atoms[x].atomicNumber !== 1).length,
      role: k === parent || ofParent.includes(k) ? 'parent' : 'other',
      ...(copies.length > 0 && (k === parent || copies.includes(k)) ? { copies: copies.length + 1 } : {}),
    } as Omit<ComponentFacts, 'smiles'> as ComponentFacts;
    // Written on first read (JSON output, a report): most consumers never look at it, and writing SMILES is
    // a large share of describe()'s time. Enumerable, so JSON and structured clone see a plain field.
    let smiles: string | null = null;
    Object.defineProperty(f, 'smiles', {
      get: () => (smiles ??= writeSmiles(single ? s : extractAtoms(s, c))),
      enumerable: true,
    });
    return f;
  });
}
