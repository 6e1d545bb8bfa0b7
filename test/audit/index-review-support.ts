/**
 * For the tests of the review against the registry index: the demo registry copied into a git repository of its
 * own, the review as it was before the index (every record loaded, src/registry/load.ts), and the index review
 * through runAudit with its log kept.
 */
import { cpSync, mkdtempSync, realpathSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadConfig } from '../../src/audit/config.js';
import { defaultEngine } from '../../src/audit/engine.js';
import { auditRecords, runAudit } from '../../src/audit/run.js';
import { selectRecords } from '../../src/audit/select.js';
import { CHECKS } from '../../src/checks/index.js';
import { loadRegistry } from '../../src/registry/load.js';
import { renderJson } from '../../src/report/json.js';
import { renderMarkdown } from '../../src/report/markdown.js';
import { tempRepo } from '../github/support/git.js';

export const DEMO = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'fixtures', 'demo-registry');

export interface DemoCopy {
  root: string;
  git(...args: string[]): string;
  remove(): void;
}

/** The demo registry in a temporary folder; with `git`, committed as the first commit of a new repository. */
export function demoCopy(withGit: boolean): DemoCopy {
  if (withGit) {
    const repo = tempRepo();
    cpSync(DEMO, repo.dir, { recursive: true });
    repo.commit('demo registry');
    return { root: repo.dir, git: repo.git, remove: repo.dispose };
  }
  const root = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-index-')));
  cpSync(DEMO, root, { recursive: true });
  return {
    root,
    git: () => {
      throw new Error('not a git repository');
    },
    remove: () => rmSync(root, { recursive: true, force: true }),
  };
}

/** What a person sees of a result: the JSON report and the Markdown checklist. */
export function seen(result: Awaited<ReturnType<typeof runAudit>>): string {
  return `${renderJson(result)}\n${renderMarkdown(result, { maxChars: Number.POSITIVE_INFINITY })}`;
}

/** The review as it was before the index: every record of the registry loaded and described. */
export async function loadedReview(root: string, paths: string[]): Promise<string> {
  const { config } = loadConfig(root);
  const engine = await defaultEngine({ axisOrthoMin: config.axisOrthoMin });
  const load = loadRegistry(root, { recordDirs: config.recordDirs });
  const sel = selectRecords(load.records, root, paths);
  const toAudit = load.records.filter((r) => sel.selected.has(r));
  const result = auditRecords(toAudit, { checks: CHECKS, config, engine, registry: load.records });
  if (sel.unmatched.length > 0) result.unmatched = sel.unmatched;
  return seen(result);
}

/** The review through the index (runAudit with paths), and the lines it logged. */
export async function indexReview(
  root: string,
  paths: string[],
  indexCache: string | null,
): Promise<{ seen: string; log: string[]; result: Awaited<ReturnType<typeof runAudit>> }> {
  const log: string[] = [];
  const result = await runAudit({ root, paths, indexCache, log: (l) => log.push(l) });
  return { seen: seen(result), log, result };
}

/** "12 from the cache; 3 read; …" -> { cached: 12, read: 3 } from the index line of the log. */
export function counts(log: string[]): { cached: number; read: number } {
  const line = log.find((l) => l.startsWith('Registry index:')) ?? '';
  const cached = /(\d+) from the cache/.exec(line);
  const read = /(\d+) read;/.exec(line);
  return { cached: Number(cached?.[1] ?? NaN), read: Number(read?.[1] ?? NaN) };
}
