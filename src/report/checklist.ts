/**
 * The checklist of one record as plain data, shared by the text and Markdown reports: open findings first (the
 * work to do), then findings accepted by waivers, then the checks that passed, then the checks that did not run
 * (with the reason; never shown as passed); plus one line of computed evidence.
 */
import type { StereoUnitFact, StructureFacts } from '../chem/facts.js';
import type { Finding, RecordResult } from '../audit/types.js';
import { plural } from '../checks/words.js';

export { plural };

export type ChecklistItem =
  | { kind: 'open'; finding: Finding }
  | { kind: 'accepted'; finding: Finding; reason: string; approvedBy: string; covers: string | null }
  | { kind: 'passed'; check: string; evidence: string }
  | { kind: 'not-run'; check: string; reason: string };

const ORDER: Record<Finding['severity'], number> = { error: 0, warning: 1, note: 2 };

/** Worst open severity of a record: 0 error, 1 warning, 2 note, 3 none open. */
export function worstOpen(r: RecordResult): number {
  let w = 3;
  for (const f of r.findings) if (!f.waived) w = Math.min(w, ORDER[f.severity]);
  return w;
}

/**
 * Records in reading order for a person: records with open errors first, then warnings, then notes, then the
 * rest; the audit's order within each group (a stable sort).
 */
export function byNeedForAction<T extends RecordResult>(records: readonly T[]): T[] {
  return records
    .map((r, i) => ({ r, i, w: worstOpen(r) }))
    .sort((a, b) => a.w - b.w || a.i - b.i)
    .map((x) => x.r);
}

export function checklistItems(r: RecordResult): ChecklistItem[] {
  const open = r.findings.filter((f) => !f.waived).sort((a, b) => ORDER[a.severity] - ORDER[b.severity]);
  const items: ChecklistItem[] = open.map((finding) => ({ kind: 'open', finding }));
  for (const f of r.findings) {
    if (f.waived)
      items.push({
        kind: 'accepted',
        finding: f,
        reason: f.waived.reason,
        approvedBy: f.waived.approvedBy,
        covers: f.waived.covers ?? null,
      });
  }
  for (const p of r.passed) items.push({ kind: 'passed', check: p.check, evidence: p.evidence });
  for (const n of r.notRun ?? []) items.push({ kind: 'not-run', check: n.check, reason: n.reason });
  return items;
}

/** Counts of open findings by severity. */
export function openCounts(r: RecordResult): {
  errors: number;
  warnings: number;
  notes: number;
  waived: number;
} {
  const c = { errors: 0, warnings: 0, notes: 0, waived: 0 };
  for (const f of r.findings) {
    if (f.waived) c.waived++;
    else if (f.severity === 'error') c.errors++;
    else if (f.severity === 'warning') c.warnings++;
    else c.notes++;
  }
  return c;
}

/** The declared claim in a few words: "single-enantiomer, (2R,3R)". */
export function declaredText(r: RecordResult): string | null {
  const parts = [r.declared.form, r.declared.descriptors].filter(
    (x): x is string => typeof x === 'string' && x !== '',
  );
  return parts.length ? parts.join(', ') : null;
}

/** "C2" with a locant, "C (atom 11)" without — the naming the findings use. */
function unitName(atoms: number[], locants: (number | null)[] | undefined, element: string): string {
  const loc = locants?.[0];
  return loc !== null && loc !== undefined ? `${element}${loc}` : `${element} (atom ${atoms.join('/')})`;
}

/** Units in reading order: by locant where they have one, then by atom number. */
function byLocant(a: StereoUnitFact, b: StereoUnitFact): number {
  const la = a.locants?.[0] ?? Infinity;
  const lb = b.locants?.[0] ?? Infinity;
  return la !== lb ? la - lb : a.atoms[0] - b.atoms[0];
}

/** The computed facts in one line: "chiral; 2 stereocentres (C2 R, C3 R); 3 stereoisomers; C4H6O6". */
export function computedText(facts: StructureFacts | null): string | null {
  if (!facts) return null;
  const parts: string[] = [];
  parts.push(
    facts.chiral === true
      ? 'chiral'
      : facts.chiral === false
        ? facts.meso
          ? 'achiral (meso)'
          : 'achiral'
        : 'chirality open (undefined units)',
  );
  const units = facts.units ?? [];
  if (units.length === 0) parts.push('no stereo units');
  else {
    const shown = [...units]
      .sort(byLocant)
      .slice(0, 8)
      .map((u) => {
        const name = unitName(u.atoms, u.locants, u.element);
        return `${name} ${u.defined ? (u.label ?? 'defined, no CIP label') : 'undefined'}`;
      });
    const more = units.length > 8 ? `, … ${units.length - 8} more` : '';
    parts.push(`${plural(units.length, 'stereo unit')} (${shown.join(', ')}${more})`);
  }
  if (facts.stereoisomers)
    parts.push(`${plural(facts.stereoisomers.total, 'stereoisomer')} of this constitution`);
  if (facts.enhanced && facts.enhanced.meaning !== 'none' && facts.enhanced.meaning !== 'absolute') {
    parts.push(`enhanced stereo: ${facts.enhanced.meaning}`);
  }
  if (facts.formula) parts.push(facts.formula);
  return parts.join('; ');
}
