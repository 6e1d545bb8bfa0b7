/**
 * Planar chirality of trans double bonds in medium rings (8–11 atoms): the ring spans one face of a twisted
 * trans double bond, so (E)-cyclooctene exists as a pair of enantiomers (resolved by Cope et al., J. Am. Chem.
 * Soc. 1963 — from memory); from 12 atoms on the ring swings through and the twist is lost (common practice, no
 * source). Such a bond has three configurations, not two: Z (ring-cis, achiral as far as the bond goes) and the
 * two twisted E forms.
 *
 * Modelled as a second unit on the bond ('planar', parity mode: reflection flips it) that exists only while its
 * host double bond is ring-trans. States keep its bit at 0 while the host is ring-cis (symmetry/ normalises
 * them so), which makes the three configurations three states. Its reference tokens are the host's four
 * substituents; in a 3D input the sense of the twist of the ring torsion across the bond gives its configuration.
 */
import type { Graph, RingInfo } from '../graph/index.js';
import type { Structure } from '../types.js';
import { rebase, type PerceivedUnit } from './units.js';

type Vec = [number, number, number];

export interface PlanarLinks {
  /** unit -> its host double-bond unit (planar units), else -1 */
  host: Int32Array;
  /** host unit -> its planar unit, else -1 */
  planarOf: Int32Array;
  /** For a planar unit: the host bit that means ring-cis (the planar unit is absent then). */
  zBit: Uint8Array;
  /** false when the structure has no planar unit (every host entry -1). */
  any: boolean;
}

/**
 * The image of unit u of one perception under an atom map, as a unit index of `target`: the unit on the image
 * of u's first atom, or for a planar unit the planar unit of that (host) unit; -1 when there is none.
 */
export function unitImage(
  target: { unitOfAtom: Int32Array; planar: PlanarLinks },
  u: PerceivedUnit,
  map: ArrayLike<number>,
): number {
  const j = target.unitOfAtom[map[u.atoms[0]]];
  if (u.kind !== 'planar' || j < 0) return j;
  return j < target.planar.planarOf.length ? target.planar.planarOf[j] : -1;
}

/** The links of a structure without planar units (shared: nothing reads past `any`). */
const NO_PLANAR: PlanarLinks = Object.freeze({
  host: new Int32Array(0),
  planarOf: new Int32Array(0),
  zBit: new Uint8Array(0),
  any: false,
});

/** Appends one planar unit per medium-ring double bond; returns the links between hosts and planar units. */
export function addPlanarUnits(s: Structure, g: Graph, rings: RingInfo, units: PerceivedUnit[]): PlanarLinks {
  const hosts: { k: number; z: 0 | 1; ra: number; rb: number }[] = [];
  for (let k = 0; k < units.length; k++) {
    const u = units[k];
    if (u.kind !== 'double-bond') continue;
    const [a, b] = u.atoms;
    const bond = bondBetween(g, a, b);
    const size = bond >= 0 ? rings.smallestRingOfBond[bond] : 0;
    if (size < 8 || size > 11) continue;
    const ring = rings.rings.find((r) => r.length === size && ringAdjacent(r, a, b));
    if (!ring) continue;
    const ra = ringNeighbour(ring, a, b);
    const rb = ringNeighbour(ring, b, a);
    // bit 0 = tokens[0] and tokens[2] cis; each that is not the ring neighbour swaps the meaning
    const z = ((u.tokens[0] === ra ? 0 : 1) ^ (u.tokens[2] === rb ? 0 : 1)) as 0 | 1;
    hosts.push({ k, z, ra, rb });
  }
  if (hosts.length === 0) return NO_PLANAR;
  const m = units.length + hosts.length;
  const links: PlanarLinks = {
    host: new Int32Array(m).fill(-1),
    planarOf: new Int32Array(m).fill(-1),
    zBit: new Uint8Array(m),
    any: hosts.length > 0,
  };
  for (const { k, z, ra, rb } of hosts) {
    const h = units[k];
    const j = units.length;
    const ringCis = h.defined && h.bit === z;
    const bit = h.defined && !ringCis ? twist(s, h, ra, rb) : null;
    units.push({
      kind: 'planar',
      mode: 'parity',
      atoms: [h.atoms[0], h.atoms[1]],
      tokens: [h.tokens[0], h.tokens[1], h.tokens[2], h.tokens[3]],
      // ring-cis: there is nothing to define (the state holds 0); ring-trans: the twist from 3D coordinates
      defined: ringCis || bit !== null,
      bit: bit ?? 0,
      equivalentPair: false,
    });
    links.host[j] = k;
    links.planarOf[k] = j;
    links.zBit[j] = z;
  }
  return links;
}

/**
 * The twist of a ring-trans bond from 3D coordinates: the sign of sin(θ), θ the torsion ring–C=C–ring (180° ± the
 * twist), stated on [ra, other, rb, other] and rebased onto the unit's tokens (swapping the two substituents of
 * one end changes the sign of the sine, as a parity bit flips). null without 3D coordinates or when flat.
 */
function twist(s: Structure, u: PerceivedUnit, ra: number, rb: number): 0 | 1 | null {
  if (s.dimension !== 3) return null;
  const [a, b] = u.atoms;
  const p = [ra, a, b, rb].map((i) => s.atoms[i].coords);
  if (p.some((c) => c === null)) return null;
  const sin = torsionSine(p[0]!, p[1]!, p[2]!, p[3]!);
  if (Math.abs(sin) < MIN_TWIST_SINE) return null;
  const oa = u.tokens[0] === ra ? u.tokens[1] : u.tokens[0];
  const ob = u.tokens[2] === rb ? u.tokens[3] : u.tokens[2];
  const bit = rebase(u, [ra, oa, rb, ob], sin > 0 ? 0 : 1);
  return bit < 0 ? null : (bit as 0 | 1);
}

/** About 0.3°: a drawing flatter than that does not state a twist. */
const MIN_TWIST_SINE = 0.005;

function torsionSine(p0: Vec, p1: Vec, p2: Vec, p3: Vec): number {
  const d = (x: Vec, y: Vec): Vec => [x[0] - y[0], x[1] - y[1], x[2] - y[2]];
  const cross = (x: Vec, y: Vec): Vec => [
    x[1] * y[2] - x[2] * y[1],
    x[2] * y[0] - x[0] * y[2],
    x[0] * y[1] - x[1] * y[0],
  ];
  const dot = (x: Vec, y: Vec): number => x[0] * y[0] + x[1] * y[1] + x[2] * y[2];
  const b1 = d(p1, p0);
  const b2 = d(p2, p1);
  const b3 = d(p3, p2);
  const n1 = cross(b1, b2);
  const n2 = cross(b2, b3);
  const y = Math.sqrt(dot(b2, b2)) * dot(b1, n2);
  const x = dot(n1, n2);
  const r = Math.hypot(x, y);
  return r === 0 ? 0 : y / r;
}

function bondBetween(g: Graph, a: number, b: number): number {
  const k = g.nbrs[a].indexOf(b);
  return k < 0 ? -1 : g.nbrBonds[a][k];
}

function ringAdjacent(r: number[], a: number, b: number): boolean {
  const k = r.indexOf(a);
  if (k < 0) return false;
  return r[(k + 1) % r.length] === b || r[(k + r.length - 1) % r.length] === b;
}

function ringNeighbour(ring: number[], x: number, other: number): number {
  const k = ring.indexOf(x);
  const prev = ring[(k + ring.length - 1) % ring.length];
  const next = ring[(k + 1) % ring.length];
  return prev === other ? next : prev;
}
