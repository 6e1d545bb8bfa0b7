/**
 * The registry-wide phase in a report, said once: whether it ran (or why not), then the enantiomer pairs and the
 * identical records it found, each pair on one line. Registering both enantiomers is normal, so pairs are listed
 * here rather than as a note on every record.
 */
import type { RegistrySummary } from '../audit/types.js';
import { plural as count } from '../checks/words.js';

/** How many pairs a text summary lists before it points at the JSON output. */
export const PAIRS_SHOWN = 50;

export function registryLines(
  r: RegistrySummary | undefined,
  safe: (s: string) => string = (s) => s,
): string[] {
  if (!r) return [];
  if (r.status === 'not-run') return [`Registry-wide checks not run: ${safe(r.reason)}.`];
  const name = (x: { id: string | null; file: string }) => safe(x.id ?? x.file);
  const enantiomers = r.pairs.filter((p) => p.relation === 'enantiomers');
  const identical = r.pairs.filter((p) => p.relation === 'identical');
  const over =
    r.comparedWith === undefined
      ? `over ${count(r.records, 'record')}`
      : `of ${count(r.records, 'record')} under review against the registry (${count(r.comparedWith, 'record')})`;
  const lines = [
    `Registry-wide checks ${over}: ${count(enantiomers.length, 'enantiomer pair')}, ` +
      `${count(identical.length, 'pair')} of identical structures.`,
  ];
  const list = (title: string, pairs: RegistrySummary['pairs']) => {
    if (pairs.length === 0) return;
    lines.push(`  ${title}:`);
    for (const p of pairs.slice(0, PAIRS_SHOWN)) lines.push(`    ${name(p.first)} — ${name(p.second)}`);
    if (pairs.length > PAIRS_SHOWN)
      lines.push(`    … and ${pairs.length - PAIRS_SHOWN} more (see the JSON output)`);
  };
  list('identical structures (findings on the later record)', identical);
  list('enantiomer pairs (both registered; fine when meant)', enantiomers);
  return lines;
}
