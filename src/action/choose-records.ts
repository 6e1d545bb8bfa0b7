/**
 * Step one of a review: which record files to audit. On a pull request (records: changed) those it changes, found
 * through the API or git; otherwise every record, or the ones the workflow lists.
 */
import { listChangedFiles, type ChangedFile } from '../github/changed-files.js';
import type { GitHubClient } from '../github/client.js';
import { gitChangedFiles } from '../github/git-diff.js';
import type { Engine, Runner } from './ports.js';
import { selectChanged } from './select-records.js';
import type { ActionSettings } from './settings.js';
import { plural } from '../checks/words.js';

export interface Chosen {
  /** Record files and molfiles relative to the registry root; undefined: every record; []: none. */
  paths: string[] | undefined;
  /** The pull request's changed files, when they were listed (their patches place inline comments). */
  changed: ChangedFile[] | null;
  changedSource: 'api' | 'git' | null;
}

export async function chooseRecords(
  settings: ActionSettings,
  engine: Engine,
  client: GitHubClient | null,
  runner: Runner,
): Promise<Chosen> {
  const choice = settings.records;
  if (choice.kind === 'all') return { paths: undefined, changed: null, changedSource: null };
  if (choice.kind === 'listed') return { paths: choice.paths, changed: null, changedSource: null };
  const pr = settings.pullRequest;
  if (pr === null) {
    runner.info(`Event '${settings.eventName}' is not a pull request: auditing every record.`);
    return { paths: undefined, changed: null, changedSource: null };
  }
  let changed: ChangedFile[];
  let source: 'api' | 'git';
  try {
    if (client === null) {
      changed = await gitChangedFiles(settings.repoRoot, pr.baseSha, pr.headSha);
      source = 'git';
      runner.info('No token given: listed the changed files with git diff.');
    } else {
      const listed = await listChangedFiles(client, pr, settings.repoRoot);
      changed = listed.files;
      source = listed.source;
      if (listed.reason !== null)
        runner.info(`Listed the changed files with git diff, because ${listed.reason}.`);
    }
  } catch (error) {
    runner.warning(
      `Could not list the files of pull request #${pr.number} (${message(error)}); auditing every record instead. ` +
        'With more than 3,000 changed files, check out with fetch-depth: 0 so that git can list them.',
    );
    return { paths: undefined, changed: null, changedSource: null };
  }
  const recordDirs = await engine.recordDirs(settings.registryRoot, settings.configFile);
  const selection = selectChanged(changed, { registryDir: settings.registryDir, recordDirs });
  runner.info(
    `Pull request #${pr.number} changes ${plural(changed.length, 'file')}: ${plural(selection.records.length, 'record file')}` +
      (selection.molfiles.length > 0
        ? ` and ${plural(selection.molfiles.length, 'molfile')}, whose records are audited too.`
        : '.'),
  );
  return { paths: [...selection.records, ...selection.molfiles], changed, changedSource: source };
}

export function message(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}
