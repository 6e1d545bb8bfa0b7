/**
 * Check: the record's waivers themselves. A waiver accepts findings of one check for this record (the audit marks
 * them as waived, with who and why): every finding of the check, or, narrowed, only those with one message id
 * (`message_id`) and/or only those about one other record (`other_record`). It needs a reason and an approver,
 * and it should match a finding. This module is listed last in CHECKS so that `ctx.findings` holds every other
 * check's findings. The matching itself (`waiverAccepts`, `acceptingWaiver`) is here too, for the audit.
 */
import type { CompoundRecord, Waiver } from '../registry/types.js';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';
import { finding, plural } from './words.js';

export const WAIVER_CHECK_ID = 'waiver-review';

const messages = {
  'waiver-incomplete':
    'The waiver for {waivedCheck} (waivers[{index}]) has no {missing}. A waiver records a decision: say why the ' +
    'finding is acceptable (reason) and who decided (approved_by). Until then it accepts nothing.',
  'waiver-matches-nothing':
    'The waiver waivers[{index}], for {covers}, matches no finding on this record{known}. Remove it, or ' +
    'correct what it names, so that it does not silently accept a future finding.',
  'waiver-duplicate': 'waivers[{index}] repeats waivers[{first}], the waiver for {covers}. Keep one.',
} as const;

/** The part of a finding a waiver is matched against. */
export interface WaivableFinding {
  check: string;
  messageId: string;
  data: RawFinding['data'];
}

/** A waiver of a record with its place in the record's list (waivers[index]). */
export type IndexedWaiver = Waiver & { index: number };

/** What the finding says the other record is, under the data keys that name one (registry, origin inputs). */
const OTHER_RECORD_KEYS = ['otherId', 'otherFile', 'input'] as const;

function blank(s: string | undefined): boolean {
  return s === undefined || s.trim() === '';
}

/** A waiver with a reason and an approver: only such a waiver accepts findings. */
export function isComplete(w: Waiver): boolean {
  return !blank(w.reason) && !blank(w.approved_by);
}

/** Whether `w` names this finding: its check, and its message id and other record where the waiver gives them. */
export function waiverAccepts(
  w: Pick<Waiver, 'check' | 'message_id' | 'other_record'>,
  f: WaivableFinding,
): boolean {
  if (w.check !== f.check) return false;
  if (!blank(w.message_id) && w.message_id!.trim() !== f.messageId) return false;
  if (!blank(w.other_record)) {
    const other = w.other_record!.trim();
    if (!OTHER_RECORD_KEYS.some((k) => f.data[k] !== undefined && String(f.data[k]) === other)) return false;
  }
  return true;
}

/** What a waiver covers, in words: "every finding of rotation-consistent", "consistent-with-registry (…)". */
export function waiverCovers(w: Pick<Waiver, 'check' | 'message_id' | 'other_record'>): string {
  const parts = [
    blank(w.message_id) ? null : `message ${w.message_id!.trim()}`,
    blank(w.other_record) ? null : `about ${w.other_record!.trim()}`,
  ].filter((x): x is string => x !== null);
  return parts.length === 0 ? `every finding of ${w.check}` : `${w.check} (${parts.join(', ')})`;
}

/** The `waived` mark of a finding: the first complete waiver of the record that accepts it, or null. */
export function acceptingWaiver(
  waivers: readonly Waiver[],
  f: WaivableFinding,
): { reason: string; approvedBy: string; covers: string } | null {
  const w = waivers.find((x) => isComplete(x) && waiverAccepts(x, f));
  return w ? { reason: w.reason!.trim(), approvedBy: w.approved_by!.trim(), covers: waiverCovers(w) } : null;
}

/** The record's waivers of one check, with their places in the list (what a registry-index row keeps). */
export function waiversOf(record: CompoundRecord | null, check: string): IndexedWaiver[] {
  return (record?.waivers ?? []).flatMap((w, index) => (w.check === check ? [{ ...w, index }] : []));
}

/** Whether a 'waiver-matches-nothing' note still holds once `more` findings were added (the registry phase). */
export function stillMatchesNothing(note: WaivableFinding, more: readonly WaivableFinding[]): boolean {
  if (note.messageId !== 'waiver-matches-nothing') return true;
  const str = (v: unknown) => (typeof v === 'string' && v !== '' ? v : undefined);
  const w = {
    check: String(note.data.waivedCheck),
    message_id: str(note.data.waivedMessage),
    other_record: str(note.data.waivedRecord),
  };
  return !more.some((f) => waiverAccepts(w, f));
}

/**
 * The waiver findings for `record`, given the findings every other check made on it (`check` = check id).
 * Pure; the waiver check calls it with `ctx.findings`, and an audit that collects findings differently may call
 * it directly after the other checks. Returned findings belong to the check `waiver-review`.
 */
export function reviewWaivers(
  record: CompoundRecord | null,
  findings: readonly WaivableFinding[],
  knownChecks?: readonly string[],
): RawFinding[] {
  const waivers = record?.waivers ?? [];
  const out: RawFinding[] = [];
  const firstIndex = new Map<string, number>();
  waivers.forEach((w, index) => {
    const field = `waivers.${index}`;
    const covers = waiverCovers(w);
    const missing = [
      blank(w.reason) ? 'reason' : null,
      blank(w.approved_by) ? 'approver (approved_by)' : null,
    ].filter((x): x is string => x !== null);
    if (missing.length) {
      out.push(
        finding('waiver-incomplete', field, {
          waivedCheck: w.check,
          index,
          missing: missing.join(' and no '),
        }),
      );
    }
    const seen = firstIndex.get(covers);
    if (seen !== undefined) {
      out.push(
        finding('waiver-duplicate', field, { waivedCheck: w.check, covers, index, first: seen }, 'note'),
      );
      return;
    }
    firstIndex.set(covers, index);
    if (w.check !== WAIVER_CHECK_ID && !findings.some((f) => waiverAccepts(w, f))) {
      const unknown = knownChecks !== undefined && !knownChecks.includes(w.check);
      out.push(
        finding(
          'waiver-matches-nothing',
          field,
          {
            waivedCheck: w.check,
            waivedMessage: blank(w.message_id) ? null : w.message_id!.trim(),
            waivedRecord: blank(w.other_record) ? null : w.other_record!.trim(),
            covers,
            index,
            knownCheck: !unknown,
            known: unknown ? ' (and no check has that id)' : '',
          },
          'note',
        ),
      );
    }
  });
  return out;
}

function run(ctx: CheckContext): CheckOutcome {
  const waivers = ctx.record?.waivers ?? [];
  if (waivers.length === 0) return { findings: [], notApplicable: 'the record has no waivers' };
  const others = ctx.findings ?? [];
  const findings = reviewWaivers(ctx.record, others);
  if (findings.some((f) => f.severity !== 'note')) return { findings };
  const accepting = waivers.filter((w) => others.some((f) => waiverAccepts(w, f)));
  const whole = accepting.filter((w) => blank(w.message_id) && blank(w.other_record));
  const wholeText =
    whole.length > 0
      ? `; ${whole.length === 1 ? 'one covers' : `${whole.length} cover`} every finding of its check ` +
        `(${whole.map((w) => w.check).join(', ')}), as it names no message_id or other_record`
      : '';
  return {
    findings,
    passed:
      `${plural(waivers.length, 'waiver')} complete; ${accepting.length} ` +
      `${accepting.length === 1 ? 'accepts' : 'accept'} findings of this record${wholeText}`,
  };
}

export const waiverReview: CheckModule = {
  id: WAIVER_CHECK_ID,
  defaultSeverity: 'warning',
  summary: 'Waivers give a reason and an approver, and each accepts a finding of this record.',
  explanation:
    'A waiver is the responsible chemist accepting a finding for this record; it is only as good as its reason ' +
    'and the name of who decided (common practice, no source: review decisions are recorded with their reason ' +
    'and approver). A waiver that names only a check accepts every finding of that check on the record, a later, ' +
    'different one too; message_id (one message of the check) and other_record (findings about one other ' +
    'record) narrow it to the finding that was decided. A waiver that accepts nothing is reported, so that it ' +
    'can be removed before it hides a later, different problem.',
  messages,
  run,
};
