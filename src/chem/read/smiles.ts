/**
 * SMILES (with optional CXSMILES block and title) -> Structure.
 * Steps: syntax (smiles-parse.ts) -> aromatic bonds outside rings become single -> kekulization
 * (kekulize.ts) -> valence check (no checked atom above its highest valence) and implicit hydrogens from the
 * Kekulé form (valence.ts, OpenSMILES organic-subset rule) -> stereo (smiles-stereo.ts) -> CXSMILES enhanced
 * stereo, radicals and drawing: coordinates and wedges (cxsmiles.ts, cxsmiles-drawing.ts). Bad input is
 * returned as an error with a 0-based offset; nothing here throws on any input.
 */
import type { Atom, Bond, BondOrder, ReadError, ReadResult, StereoGroup, Structure } from '../types.js';
import { newAtom, newBond, newStructure, objectList } from './make.js';
import { parseCxExtension } from './cxsmiles.js';
import { applyDrawing, type CxDrawing } from './cxsmiles-drawing.js';
import { kekulize } from './kekulize.js';
import { parseSmilesGraph, type SmilesGraph } from './smiles-parse.js';
import { buildStereo } from './smiles-stereo.js';
import { defaultValences, implicitHydrogens, isMetal, valenceProblem } from './valence.js';

/*
 * Working arrays reused from one SMILES to the next (reading is synchronous and not re-entrant, and none of them
 * outlives a call): small typed arrays are each a separate off-heap allocation, several per SMILES otherwise.
 */
let capN = 0;
let capM = 0;
let ORDER = new Uint8Array(0); // per bond
let BRIDGE = new Uint8Array(0); // per bond
let HCOUNT = new Int32Array(0); // per atom, and the rest too
let RADICAL = new Uint8Array(0);
let NEEDS_DOUBLE = new Uint8Array(0);
let DISC = new Int32Array(0);
let LOW = new Int32Array(0);
let PARENT_BOND = new Int32Array(0);
let ITER = new Int32Array(0);
let STACK = new Int32Array(0);

function reserve(n: number, m: number): void {
  if (m > capM || capM > 1 << 16) {
    capM = Math.max(m, 64);
    ORDER = new Uint8Array(capM);
    BRIDGE = new Uint8Array(capM);
  }
  if (n > capN || capN > 1 << 16) {
    capN = Math.max(n, 64);
    HCOUNT = new Int32Array(capN);
    RADICAL = new Uint8Array(capN);
    NEEDS_DOUBLE = new Uint8Array(capN);
    DISC = new Int32Array(capN);
    LOW = new Int32Array(capN);
    PARENT_BOND = new Int32Array(capN);
    ITER = new Int32Array(capN);
    STACK = new Int32Array(capN);
  }
}

function isSpace(c: number): boolean {
  return c === 32 || c === 9 || c === 10 || c === 13;
}

function failure(code: string, message: string, offset: number): ReadResult {
  return { ok: false, error: { code, message, at: { offset } } };
}

export function parseSmiles(text: string): ReadResult {
  try {
    return parse(text);
  } catch (e) {
    // A bug, not bad input; still report it as data so a bulk audit carries on.
    return failure(
      'smiles-internal-error',
      `internal error while reading SMILES: ${(e as Error).message}`,
      0,
    );
  }
}

function parse(text: string): ReadResult {
  let start = 0;
  while (start < text.length && isSpace(text.charCodeAt(start))) start++;
  const g = parseSmilesGraph(text, start);
  if ('error' in g)
    return {
      ok: false,
      error: { code: g.error.code, message: g.error.message, at: { offset: g.error.offset } },
    };
  const warnings = objectList<ReadError>();
  for (const w of g.warnings) warnings.push({ code: w.code, message: w.message, at: { offset: w.offset } });
  const n = g.atoms.length;
  const m = g.bondCount;

  // after the SMILES: optional CXSMILES block, then an optional title
  let i = g.end;
  while (i < text.length && isSpace(text.charCodeAt(i))) i++;
  let groups: Structure['groups'] | null = null;
  let cxRadicals: Map<number, number> | null = null;
  let cxDrawing: CxDrawing | null = null;
  if (i < text.length && text.charCodeAt(i) === 124) {
    const cx = parseCxExtension(text, i, n, m);
    if (!cx.ok) return cx;
    groups = cx.groups;
    if (cx.radicals.size > 0) cxRadicals = cx.radicals;
    if (cx.coords !== null || cx.wedges.length > 0) cxDrawing = cx;
    i = cx.end;
  }
  const title = text.slice(i).trim();

  // bond orders (Kekulé) and aromatic flags
  reserve(n, m);
  const order = ORDER;
  for (let k = 0; k < m; k++) order[k] = g.bondOrder[k]!;
  let anyAromatic = false;
  for (let a = 0; a < n && !anyAromatic; a++) if (g.atoms[a]!.aromatic) anyAromatic = true;
  if (anyAromatic) {
    const err = kekulizeGraph(g, order);
    if (err) return err;
  }

  // hydrogens and radicals
  const hCount = HCOUNT;
  const radical = RADICAL;
  radical.fill(0, 0, n);
  const { nbrStart, nbrBond, bondA, bondB } = g;
  for (let a = 0; a < n; a++) {
    const ra = g.atoms[a]!;
    let sum = 0;
    let oxo = 0;
    let multiple = 0;
    let metal = 0;
    for (let e = nbrStart[a]!, stop = nbrStart[a + 1]!; e < stop; e++) {
      const bi = nbrBond[e]!;
      sum += order[bi]!;
      if (order[bi]! >= 2) multiple++;
      const other = g.atoms[bondA[bi] === a ? bondB[bi]! : bondA[bi]!]!.atomicNumber;
      if (order[bi] === 2 && other === 8) oxo++;
      if (isMetal(other)) metal += order[bi]!;
    }
    // OpenSMILES: an organic-subset atom whose bonds exceed its highest normal valence gets no H; we go further
    // and refuse any checked atom (organic subset or bracket) with more bonds than its highest valence.
    const problem = valenceProblem(
      ra.atomicNumber,
      ra.charge,
      sum,
      ra.hCount < 0 ? 0 : ra.hCount,
      oxo,
      multiple,
      metal,
    );
    if (problem !== null) return failure('smiles-valence', problem, ra.offset);
    if (ra.hCount < 0) {
      hCount[a] = ra.atomicNumber === 0 ? 0 : implicitHydrogens(ra.atomicNumber, 0, sum);
    } else {
      hCount[a] = ra.hCount;
      const vals = defaultValences(ra.atomicNumber, ra.charge);
      const used = sum + ra.hCount;
      if (vals.length > 0 && used < vals[0]!) radical[a] = Math.min(2, vals[0]! - used);
    }
  }
  // radicals the CXSMILES block states override what the bracket atoms imply
  if (cxRadicals) for (const [a, r] of cxRadicals) radical[a] = r;

  const stereo = buildStereo(g, order, hCount, warnings);

  const atoms = objectList<Atom>();
  for (let a = 0; a < n; a++) {
    const ra = g.atoms[a]!;
    atoms.push(
      newAtom(
        ra.element,
        ra.atomicNumber,
        ra.charge,
        ra.isotope,
        hCount[a]!,
        ra.aromatic,
        radical[a]!,
        ra.mapNumber,
        a + 1,
        null,
      ),
    );
  }
  const bonds = objectList<Bond>();
  for (let k = 0; k < m; k++)
    bonds.push(newBond(bondA[k]!, bondB[k]!, order[k]! as BondOrder, g.bondAromatic[k] === 1, null));
  const structure = newStructure(
    atoms,
    bonds,
    stereo,
    groups ?? objectList<StereoGroup>(),
    null,
    title === '' ? null : title,
    {},
    0,
  );
  if (cxDrawing === null) return { ok: true, structure, warnings };
  const drawn = applyDrawing(structure, cxDrawing, (a) => g.atoms[a]!.offset, warnings);
  return 'ok' in drawn ? drawn : { ok: true, structure: drawn, warnings };
}

/**
 * Aromatic bonds outside rings become plain single bonds (`c1ccccc1c1ccccc1`: the biphenyl link); the rest get
 * a Kekulé assignment. Mutates `order` and the graph's aromatic flags. Returns an error result if impossible.
 */
function kekulizeGraph(g: SmilesGraph, order: Uint8Array): ReadResult | null {
  const n = g.atoms.length;
  const m = g.bondCount;
  const { nbrStart, nbrBond, bondAromatic } = g;
  const bridge = findBridges(g);
  const aromaticBonds: number[] = [];
  for (let k = 0; k < m; k++) {
    if (bondAromatic[k] !== 1) continue;
    if (bridge[k] && g.bondExplicit[k] !== 1) {
      bondAromatic[k] = 0;
      continue;
    }
    aromaticBonds.push(k);
  }
  const needsDouble = NEEDS_DOUBLE;
  needsDouble.fill(0, 0, n);
  let any = false;
  for (let a = 0; a < n; a++) {
    const ra = g.atoms[a]!;
    if (!ra.aromatic) continue;
    let sum = ra.hCount > 0 ? ra.hCount : 0;
    let hasAromaticBond = false;
    for (let e = nbrStart[a]!, stop = nbrStart[a + 1]!; e < stop; e++) {
      const bi = nbrBond[e]!;
      if (bondAromatic[bi] === 1) {
        sum += 1;
        hasAromaticBond = true;
      } else sum += order[bi]!;
    }
    const vals = defaultValences(ra.atomicNumber, ra.charge);
    let v = -1;
    for (let k = 0; k < vals.length; k++) {
      if (vals[k]! >= sum) {
        v = vals[k]!;
        break;
      }
    }
    if (v - sum >= 1) {
      if (!hasAromaticBond) {
        return failure(
          'smiles-kekulize',
          `cannot kekulize: aromatic atom ${ra.element} (atom ${a + 1}) is not in a ring`,
          ra.offset,
        );
      }
      needsDouble[a] = 1;
      any = true;
    }
  }
  if (!any || aromaticBonds.length === 0) return null;
  const res = kekulize({
    atomCount: n,
    bondA: g.bondA,
    bondB: g.bondB,
    aromaticBonds,
    needsDouble,
  });
  if (!res.ok) {
    const ra = g.atoms[res.atom]!;
    return failure(
      'smiles-kekulize',
      `cannot kekulize: no alternating single/double bond pattern gives aromatic atom ${ra.element} (atom ${res.atom + 1}) a double bond`,
      ra.offset,
    );
  }
  for (const k of res.doubleBonds) order[k] = 2;
  return null;
}

/** Bridges (bonds in no ring) by iterative Tarjan low-link over the whole graph. */
function findBridges(g: SmilesGraph): Uint8Array {
  const n = g.atoms.length;
  const { nbrStart, nbrAtom, nbrBond, bondA, bondB } = g;
  const bridge = BRIDGE.fill(0, 0, g.bondCount);
  const disc = DISC.fill(-1, 0, n);
  const low = LOW.fill(0, 0, n);
  const parentBond = PARENT_BOND.fill(-1, 0, n);
  const iter = ITER; // next neighbour entry per atom
  for (let v = 0; v < n; v++) iter[v] = nbrStart[v]!;
  const stack = STACK;
  let sp = 0;
  let time = 0;
  for (let s = 0; s < n; s++) {
    if (disc[s] !== -1) continue;
    disc[s] = low[s] = time++;
    stack[sp++] = s;
    while (sp > 0) {
      const v = stack[sp - 1]!;
      if (iter[v]! < nbrStart[v + 1]!) {
        const k = iter[v]!++;
        const w = nbrAtom[k]!;
        const bi = nbrBond[k]!;
        if (bi === parentBond[v]) continue;
        if (disc[w] === -1) {
          disc[w] = low[w] = time++;
          parentBond[w] = bi;
          stack[sp++] = w;
        } else if (disc[w]! < low[v]!) {
          low[v] = disc[w]!;
        }
      } else {
        sp--;
        const pb = parentBond[v]!;
        if (pb >= 0) {
          const p = bondA[pb] === v ? bondB[pb]! : bondA[pb]!;
          if (low[v]! < low[p]!) low[p] = low[v]!;
          if (low[v]! > disc[p]!) bridge[pb] = 1;
        }
      }
    }
  }
  return bridge;
}
