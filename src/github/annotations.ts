/**
 * Findings as workflow annotations (shown on the changed file in the pull request's "Files changed" tab). Pure:
 * the action hands them to the runner. Waived findings are not annotated. GitHub shows a limited number of
 * annotations per step, so the list is capped and the rest counted.
 */
import type { AuditResult, Severity } from '../audit/types.js';
import { toRepoPath } from './paths.js';

export interface Annotation {
  level: 'error' | 'warning' | 'notice';
  title: string;
  message: string;
  /** Path from the repository root. */
  file: string;
  line: number | null;
}

const LEVEL: Record<Severity, Annotation['level']> = { error: 'error', warning: 'warning', note: 'notice' };
const RANK: Record<Severity, number> = { error: 0, warning: 1, note: 2 };

export function buildAnnotations(
  result: AuditResult,
  registryDir: string,
  max = 50,
): { annotations: Annotation[]; omitted: number } {
  const all: (Annotation & { rank: number })[] = [];
  for (const record of result.records) {
    for (const finding of record.findings) {
      if (finding.waived !== null) continue;
      all.push({
        level: LEVEL[finding.severity],
        rank: RANK[finding.severity],
        title: `stereogate ${finding.check}${record.id === null ? '' : ` (${record.id})`}`,
        message: finding.message,
        file: toRepoPath(registryDir, record.file),
        line: finding.line,
      });
    }
  }
  all.sort((a, b) => a.rank - b.rank);
  const annotations = all.slice(0, max).map(({ rank: _rank, ...rest }) => rest);
  return { annotations, omitted: all.length - annotations.length };
}
