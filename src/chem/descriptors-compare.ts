/**
 * Parsed IUPAC stereodescriptors (descriptors.ts) compared with the labels the engine computed: per locant
 * through atom-map numbers, per unit where the structure has one unit of each kind cited, else by counts (and
 * whether the counts settle the claim). IUPAC 2013 recommendations P-93.1.3 for relative and racemic descriptors.
 */
import type { CipLabel, StereoUnitFact } from './facts.js';
import type { DescriptorItem, ParsedDescriptors } from './descriptors.js';

export interface LabelMismatch {
  locant: string;
  declared: string;
  computed: string;
  atoms: number[];
}

export interface DescriptorComparison {
  /**
   * per-locant: items matched to units through atom-map numbers; per-unit: matched without atom maps, because
   * the structure has exactly one unit of each kind the descriptors cite (one R/S centre, one E/Z double bond…);
   * counts: how many R, S, E, Z…; none: nothing to compare.
   */
  method: 'per-locant' | 'per-unit' | 'counts' | 'none';
  /**
   * method 'counts' with agreeing counts: true when every way of matching the cited locants to the units gives
   * the same answer (all units of a kind carry the same label, or two R/S units compared up to inversion), so
   * the counts verify the claim; false when some matchings would disagree, so it is consistent in count only.
   */
  countsDecide: boolean;
  /** When method is 'counts' or 'none': why per-locant matching was not possible. */
  whyNotPerLocant: string | null;
  agrees: boolean;
  /** Relative or racemic descriptors matched the structure's mirror-image labels (allowed for those modes). */
  matchedInverted: boolean;
  mismatches: LabelMismatch[];
  /** Declared locants that are not stereo units of the structure (per-locant only). */
  notStereoUnits: string[];
  /** Declared locants whose unit the structure leaves undefined (per-locant only). */
  undefinedAt: string[];
  /** Defined, labelled units the descriptor does not cite (per-locant only). */
  unlisted: { locant: string | null; label: CipLabel; atoms: number[] }[];
  /** Counts by label ('R', 'S', 'E', 'Z', 'M', 'P', 'r', 's', …); axial Ra/Sa counted as M/P. */
  declaredCounts: Record<string, number>;
  computedCounts: Record<string, number>;
}

/**
 * Axial descriptors: Ra corresponds to M and Sa to P (from memory: Eliel & Wilen, Stereochemistry of Organic
 * Compounds, 1994, section 14-5). The engine labels axial units with M/P; an R/S label on an axial unit is read
 * as Ra/Sa.
 */
function key(label: CipLabel, axialUnit: boolean): string {
  if (axialUnit && label === 'R') return 'M';
  if (axialUnit && label === 'S') return 'P';
  return label;
}

const MIRROR: Record<string, string> = { R: 'S', S: 'R', M: 'P', P: 'M' };
/** Reflection swaps R/S and M/P; E/Z and the pseudoasymmetric r/s, m/p stay (IUPAC 2013, P-93). */
function mirrored(k: string): string {
  return MIRROR[k] ?? k;
}

const AXIAL_KINDS = new Set(['allene', 'biaryl', 'cumulene', 'helix']);

function unitKey(u: StereoUnitFact): string | null {
  return u.label === null ? null : key(u.label, AXIAL_KINDS.has(u.kind) && u.kind !== 'cumulene');
}

function itemKey(it: DescriptorItem): string {
  return key(it.label, it.axial === true);
}

/** The locant a unit answers to: the centre's map number; for a bond/axis the lower of its two ends. */
function unitLocants(u: StereoUnitFact): number[] {
  return u.locants.filter((l): l is number => l !== null).sort((a, b) => a - b);
}

function count(keys: string[]): Record<string, number> {
  const c: Record<string, number> = {};
  for (const k of keys) c[k] = (c[k] ?? 0) + 1;
  return c;
}

function sameCounts(a: Record<string, number>, b: Record<string, number>): boolean {
  const ks = new Set([...Object.keys(a), ...Object.keys(b)]);
  for (const k of ks) if ((a[k] ?? 0) !== (b[k] ?? 0)) return false;
  return true;
}

function invertCounts(c: Record<string, number>): Record<string, number> {
  const o: Record<string, number> = {};
  for (const [k, v] of Object.entries(c)) o[mirrored(k)] = (o[mirrored(k)] ?? 0) + v;
  return o;
}

/**
 * Compares parsed descriptors with the computed units. Per locant when every cited locant is a plain number and
 * the structure carries atom-map numbers on its stereo units; otherwise by counts. Racemic and relative
 * descriptors are compared up to overall inversion (P-93.1.3: they describe the drawn stereoisomer or its
 * mirror image); so are the descriptors of an achiral structure (`options.achiral`), which is its own mirror image.
 */
export function compareDescriptors(
  parsed: ParsedDescriptors,
  units: readonly StereoUnitFact[],
  options: { achiral?: boolean } = {},
): DescriptorComparison {
  const defined = units.filter((u) => u.defined && u.label !== null);
  const result: DescriptorComparison = {
    method: 'none',
    whyNotPerLocant: null,
    countsDecide: false,
    agrees: true,
    matchedInverted: false,
    mismatches: [],
    notStereoUnits: [],
    undefinedAt: [],
    unlisted: [],
    declaredCounts: count(parsed.items.map(itemKey)),
    computedCounts: count(defined.map((u) => unitKey(u)!)),
  };
  if (parsed.items.length === 0) {
    result.whyNotPerLocant = 'the descriptor cites no configurations';
    return result;
  }
  // An achiral (meso) structure is its own mirror image: (2R,3S) and (2S,3R) name the same compound, numbered
  // from either end.
  const mayInvert = parsed.mode === 'racemic' || parsed.mode === 'relative' || options.achiral === true;
  const mapped = units.some((u) => unitLocants(u).length > 0);
  const numeric = parsed.items.every((it) => it.locant !== null && /^\d+$/.test(it.locant));
  const single = mapped && numeric ? null : matchOnePerKind(parsed.items, units);
  if ((mapped && numeric) || single) {
    result.method = single ? 'per-unit' : 'per-locant';
    const byLocant = (n: number): StereoUnitFact | undefined =>
      units.find((u) => unitLocants(u)[0] === n) ?? units.find((u) => unitLocants(u).includes(n));
    const pairs: { it: DescriptorItem; u: StereoUnitFact }[] = single ?? [];
    if (!single) {
      for (const it of parsed.items) {
        const u = byLocant(Number(it.locant));
        if (!u) result.notStereoUnits.push(it.locant!);
        else if (!u.defined || u.label === null) result.undefinedAt.push(it.locant!);
        else pairs.push({ it, u });
      }
    }
    const mismatchesFor = (invert: boolean): LabelMismatch[] =>
      pairs
        .filter(({ it, u }) => (invert ? mirrored(unitKey(u)!) : unitKey(u)) !== itemKey(it))
        .map(({ it, u }) => ({
          locant: it.locant ?? '',
          declared: it.pair ?? it.label + (it.axial ? 'a' : ''),
          computed: u.label!,
          atoms: u.atoms,
        }));
    const direct = mismatchesFor(false);
    const inverted = mayInvert ? mismatchesFor(true) : direct;
    result.matchedInverted = mayInvert && inverted.length < direct.length;
    result.mismatches = result.matchedInverted ? inverted : direct;
    const cited = new Set(pairs.map((p) => p.u));
    for (const u of defined) {
      if (!cited.has(u)) {
        result.unlisted.push({
          locant: single ? null : (unitLocants(u)[0]?.toString() ?? null),
          label: u.label!,
          atoms: u.atoms,
        });
      }
    }
    result.agrees =
      result.mismatches.length === 0 && result.notStereoUnits.length === 0 && result.undefinedAt.length === 0;
    return result;
  }
  result.method = 'counts';
  result.whyNotPerLocant = !mapped
    ? 'the structure carries no atom-map numbers on its stereo units'
    : 'not every descriptor has a plain numeric locant';
  const direct = sameCounts(result.declaredCounts, result.computedCounts);
  const inverted = mayInvert && sameCounts(invertCounts(result.declaredCounts), result.computedCounts);
  result.agrees = direct || inverted;
  result.matchedInverted = !direct && inverted;
  result.countsDecide = result.agrees && countsDecide(parsed.items, units, mayInvert);
  return result;
}

/** The kind of descriptor a label belongs to: R/S, pseudoasymmetric r/s, axial M/P (Ra/Sa), m/p, E/Z. */
type Kind = 'RS' | 'rs' | 'MP' | 'mp' | 'EZ' | 'other';

function kindOfKey(k: string): Kind {
  if (k === 'R' || k === 'S') return 'RS';
  if (k === 'r' || k === 's') return 'rs';
  if (k === 'M' || k === 'P') return 'MP';
  if (k === 'm' || k === 'p') return 'mp';
  if (k === 'E' || k === 'Z' || k === 'e' || k === 'z') return 'EZ';
  return 'other';
}

/** The kind of a unit: from its label, else (undefined) from what it is; 'other' when that cannot be told. */
function kindOfUnit(u: StereoUnitFact): Kind {
  const k = unitKey(u);
  if (k !== null) return kindOfKey(k);
  if (u.kind === 'tetrahedral') return u.pseudoasymmetric ? 'rs' : 'RS';
  if (u.kind === 'double-bond') return 'EZ';
  if (u.kind === 'allene' || u.kind === 'biaryl') return 'MP';
  return 'other';
}

/**
 * Matching without atom maps: when each kind of descriptor cited (R/S, r/s, E/Z, M/P) is cited once and the
 * structure has exactly one unit of that kind (defined or not), each descriptor can only mean that unit — a
 * single stereocentre, or one centre and one double bond. Null when some locant could mean more than one unit.
 */
function matchOnePerKind(
  items: readonly DescriptorItem[],
  units: readonly StereoUnitFact[],
): { it: DescriptorItem; u: StereoUnitFact }[] | null {
  if (units.some((u) => kindOfUnit(u) === 'other')) return null;
  const pairs: { it: DescriptorItem; u: StereoUnitFact }[] = [];
  for (const it of items) {
    const kind = kindOfKey(itemKey(it));
    const sameKindItems = items.filter((x) => kindOfKey(itemKey(x)) === kind);
    const sameKindUnits = units.filter((u) => kindOfUnit(u) === kind);
    if (kind === 'other' || sameKindItems.length !== 1 || sameKindUnits.length !== 1) return null;
    const u = sameKindUnits[0]!;
    if (!u.defined || u.label === null) return null;
    pairs.push({ it, u });
  }
  return pairs;
}

/**
 * Whether agreeing counts settle the claim: every matching of locants to units of the same kind gives the same
 * labels when all units of each kind carry one label; with inversion allowed (rac, rel, an achiral structure),
 * two R/S units and no other chiral ones are settled too (like or unlike is all two labels can say). Undefined
 * units of a cited kind leave it open (a locant could name one of them).
 */
function countsDecide(
  items: readonly DescriptorItem[],
  units: readonly StereoUnitFact[],
  mayInvert: boolean,
): boolean {
  const kinds = new Set(items.map((it) => kindOfKey(itemKey(it))));
  let chiralUnits = 0;
  let uniform = true;
  for (const kind of kinds) {
    const ofKind = units.filter((u) => kindOfUnit(u) === kind);
    if (kind === 'other' || ofKind.some((u) => !u.defined || u.label === null)) return false;
    if (kind === 'RS' || kind === 'MP') chiralUnits += ofKind.length;
    if (new Set(ofKind.map((u) => unitKey(u))).size > 1) {
      if (!(mayInvert && kind === 'RS' && ofKind.length === 2)) return false;
      uniform = false;
    }
  }
  return uniform || chiralUnits === 2;
}
