/**
 * Check: the record's waivers themselves. A waiver accepts the findings of one check for this record (the audit
 * marks those findings as waived, with who and why); it needs a reason and an approver, and it should match a
 * finding. This module is listed last in CHECKS so that `ctx.findings` holds every other check's findings.
 */
import type { CompoundRecord } from '../registry/types.js';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';
import { finding } from './words.js';

export const WAIVER_CHECK_ID = 'waiver-review';

const messages = {
  'waiver-incomplete':
    'The waiver for {waivedCheck} (waivers[{index}]) has no {missing}. A waiver records a decision: say why the ' +
    'finding is acceptable (reason) and who decided (approved_by). Until then it accepts nothing.',
  'waiver-matches-nothing':
    'The waiver for {waivedCheck} (waivers[{index}]) matches no finding on this record{known}. Remove it, or ' +
    'correct the check id, so that it does not silently accept a future finding.',
  'waiver-duplicate':
    'waivers[{index}] repeats the waiver for {waivedCheck} given in waivers[{first}]. Keep one.',
} as const;

function blank(s: string | undefined): boolean {
  return s === undefined || s.trim() === '';
}

/**
 * The waiver findings for `record`, given the findings every other check made on it (`check` = check id).
 * Pure; the waiver check calls it with `ctx.findings`, and an audit that collects findings differently may call
 * it directly after the other checks. Returned findings belong to the check `waiver-review`.
 */
export function reviewWaivers(
  record: CompoundRecord | null,
  findings: readonly { check: string }[],
  knownChecks?: readonly string[],
): RawFinding[] {
  const waivers = record?.waivers ?? [];
  const out: RawFinding[] = [];
  const firstIndex = new Map<string, number>();
  waivers.forEach((w, index) => {
    const field = `waivers.${index}`;
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
    const seen = firstIndex.get(w.check);
    if (seen !== undefined) {
      out.push(finding('waiver-duplicate', field, { waivedCheck: w.check, index, first: seen }, 'note'));
      return;
    }
    firstIndex.set(w.check, index);
    if (w.check !== WAIVER_CHECK_ID && !findings.some((f) => f.check === w.check)) {
      const unknown = knownChecks !== undefined && !knownChecks.includes(w.check);
      out.push(
        finding(
          'waiver-matches-nothing',
          field,
          {
            waivedCheck: w.check,
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
  if (waivers.length === 0) return { findings: [], notApplicable: true };
  const findings = reviewWaivers(ctx.record, ctx.findings ?? []);
  if (findings.some((f) => f.severity !== 'note')) return { findings };
  const accepted = waivers.filter((w) => (ctx.findings ?? []).some((f) => f.check === w.check)).length;
  return {
    findings,
    passed: `${waivers.length} waiver(s) complete; ${accepted} accept findings of this record`,
  };
}

export const waiverReview: CheckModule = {
  id: WAIVER_CHECK_ID,
  defaultSeverity: 'warning',
  summary: 'Waivers give a reason and an approver, and each accepts a finding of this record.',
  explanation:
    'A waiver is the responsible chemist accepting a finding for this record; it is only as good as its reason ' +
    'and the name of who decided (common practice, no source: review decisions are recorded with their reason ' +
    'and approver). A waiver that accepts nothing is removed, so that it cannot hide a later, different problem.',
  messages,
  run,
};
