/**
 * Small helpers the checks share: naming stereo units in chemists' words, reading the descriptors a record
 * states (its `stereo.descriptors` field and the front of its name), and building findings.
 */
import type { StereoUnitFact, StructureFacts } from '../chem/facts.js';
import { parseDescriptors, type ParsedDescriptors } from '../chem/descriptors.js';
import type { CompoundRecord, StereoForm } from '../registry/types.js';
import type { RawFinding } from './types.js';
import type { Severity } from '../audit/types.js';
import type { Structure } from '../chem/types.js';

/** "C2 (atom 3)" with an atom-map locant, "C (atom 3)" without; "C2=C3 double bond (atoms 2, 3)" for a bond. */
export function unitName(u: StereoUnitFact): string {
  const loc = (k: number): string =>
    u.locants[k] !== null && u.locants[k] !== undefined ? String(u.locants[k]) : '';
  if (u.kind === 'tetrahedral') return `${u.element}${loc(0)} (atom ${u.atoms[0]})`;
  const ends = u.atoms.join(', ');
  const what =
    u.kind === 'double-bond'
      ? 'double bond'
      : u.kind === 'biaryl'
        ? 'biaryl axis'
        : u.kind === 'helix'
          ? 'helix'
          : `${u.kind} axis`;
  const mapped = u.locants.every((l) => l !== null) ? ` C${u.locants.join('=C')}` : '';
  return `${what}${mapped} (atoms ${ends})`;
}

/**
 * Text from the engine names atoms by element and input number ("the middle of the C2–C4 bond"); a message that
 * also names units by locant ("C2 (atom 2) R, C3 (atom 4) S") would then call one atom by two names. This
 * rewrites those atom names in the scheme of unitName: locant with the atom number beside it where the atom
 * carries an atom-map locant ("C3 (atom 4)"), else the element with the atom number ("C (atom 4)").
 */
export function atomsInRecordTerms(text: string, s: Structure | null): string {
  if (!s) return text;
  const byNumber = new Map(s.atoms.map((a) => [a.inputNumber, a]));
  return text.replace(/\b([A-Z][a-z]?)(\d+)\b/g, (whole, el: string, num: string) => {
    const a = byNumber.get(Number(num));
    if (!a || a.element !== el) return whole;
    return a.mapNumber !== null ? `${el}${a.mapNumber} (atom ${num})` : `${el} (atom ${num})`;
  });
}

export function listUnits(units: readonly StereoUnitFact[]): string {
  return units.length === 0 ? 'none' : units.map(unitName).join(', ');
}

/** "2 stereocentres and 1 double bond", for evidence. */
export function unitSummary(units: readonly StereoUnitFact[]): string {
  const centres = units.filter((u) => u.kind === 'tetrahedral').length;
  const bonds = units.filter((u) => u.kind === 'double-bond').length;
  const axes = units.length - centres - bonds;
  const parts: string[] = [];
  if (centres) parts.push(`${centres} stereocentre${centres === 1 ? '' : 's'}`);
  if (bonds) parts.push(`${bonds} stereogenic double bond${bonds === 1 ? '' : 's'}`);
  if (axes) parts.push(`${axes} stereogenic ax${axes === 1 ? 'is' : 'es'}`);
  return parts.length ? parts.join(' and ') : 'no stereo units';
}

export function definedUnits(f: StructureFacts): StereoUnitFact[] {
  return f.units.filter((u) => u.defined);
}

export function undefinedUnits(f: StructureFacts): StereoUnitFact[] {
  return f.units.filter((u) => !u.defined);
}

/** "C2 R, C3 S" from the defined, labelled units. */
export function labelList(units: readonly StereoUnitFact[]): string {
  const l = units.filter((u) => u.defined).map((u) => `${unitName(u)} ${u.label ?? 'unranked'}`);
  return l.length ? l.join(', ') : 'none';
}

export interface DeclaredDescriptors {
  /** From stereo.descriptors. */
  field: ParsedDescriptors | null;
  /** From the front of the name. */
  name: ParsedDescriptors | null;
}

export function declaredDescriptors(record: CompoundRecord | null): DeclaredDescriptors {
  const d = record?.stereo.descriptors;
  const n = record?.name;
  return {
    field: d !== undefined && d.trim() !== '' ? parseDescriptors(d) : null,
    name: n !== undefined && n.trim() !== '' ? parseDescriptors(n, { context: 'name' }) : null,
  };
}

/** The sign of rotation the record states in its descriptors or name, with where it was found. */
export function declaredSign(record: CompoundRecord | null): { sign: '+' | '-' | '±'; field: string } | null {
  const { field, name } = declaredDescriptors(record);
  if (field?.rotationSign) return { sign: field.rotationSign, field: 'stereo.descriptors' };
  if (name?.rotationSign) return { sign: name.rotationSign, field: 'name' };
  return null;
}

export const CHIRAL_FORMS: readonly StereoForm[] = ['single-enantiomer', 'enantioenriched', 'racemate'];

/** Forms that claim some stereochemistry (everything but achiral and unknown). */
export const STEREO_CLAIM_FORMS: readonly StereoForm[] = [
  'meso',
  'single-enantiomer',
  'enantioenriched',
  'racemate',
  'single-diastereomer',
  'diastereomer-mixture',
];

export function finding(
  messageId: string,
  field: string | null,
  data: RawFinding['data'],
  severity?: Severity,
): RawFinding {
  const f: RawFinding = { messageId, field, data };
  if (severity) f.severity = severity;
  return f;
}

/**
 * Fills a message template from a finding's data; the audit renders every message through it. `{name}` is the
 * value (null reads "none"). A count agrees with its words: `{name:one|many}` is the count and the words chosen
 * by it (`{count:unit is|units are}` reads "1 unit is" or "3 units are"), `{name?one|many}` the words alone
 * (`at {count?locant|locants} {list}`). A placeholder whose name is not in the data is left as written.
 */
export function render(template: string, data: RawFinding['data']): string {
  return template.replace(
    /\{([A-Za-z0-9_]+)(?:([:?])([^|{}]*)\|([^|{}]*))?\}/g,
    (whole, name: string, how: string | undefined, one: string, many: string) => {
      if (!Object.prototype.hasOwnProperty.call(data, name)) return whole;
      const v = data[name];
      const text = v === null ? 'none' : String(v);
      if (how === undefined) return text;
      const words = text === '1' ? one : many;
      return how === ':' ? `${text} ${words}` : words;
    },
  );
}

/** A count with its noun: "1 stereo unit", "3 stereo units" (`many` defaults to `one` + s). */
export function plural(n: number | string, one: string, many = `${one}s`): string {
  return `${n} ${String(n) === '1' ? one : many}`;
}

export function fmt(n: number): string {
  return Number.isInteger(n) ? String(n) : String(Math.round(n * 100) / 100);
}
