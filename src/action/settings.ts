/**
 * Every action input and every runner variable, read in one place into one typed settings object. The rest of
 * the action takes `ActionSettings` and knows nothing about how inputs arrive.
 */
import { existsSync, readFileSync, realpathSync } from 'node:fs';
import { dirname, isAbsolute, join, relative, resolve, sep } from 'node:path';
import type { PullRequestRef } from '../github/changed-files.js';

export type FailOn = 'error' | 'warning' | 'never';

export type RecordChoice = { kind: 'changed' } | { kind: 'all' } | { kind: 'listed'; paths: string[] };

export interface ActionSettings {
  token: string;
  records: RecordChoice;
  /** Absolute real path of the job's workspace (GITHUB_WORKSPACE). */
  workspace: string;
  /**
   * The git checkout holding the registry: the nearest folder with a `.git` at or above the registry root, within
   * the workspace (the workspace itself when there is none). Git runs here; GitHub's paths are relative to it.
   */
  repoRoot: string;
  /** Absolute real path of the registry root. */
  registryRoot: string;
  /** The registry root relative to the repository root, forward slashes; '' for the root itself. */
  registryDir: string;
  /** Absolute path of the config file, or null for the audit's own default. */
  configFile: string | null;
  failOn: FailOn;
  checklistComment: boolean;
  inlineComments: boolean;
  maxInlineComments: number;
  /** Absolute paths, or null when turned off (input set to ''). */
  sarifFile: string | null;
  reportFile: string | null;
  /**
   * File keeping the registry's key index between runs (input index-cache), or null for none: by default
   * stereogate/index-cache.json in RUNNER_TEMP (none outside Actions); 'none' turns it off.
   */
  indexCache: string | null;
  apiUrl: string;
  /** Time limit, tries and longest wait for GitHub API requests (inputs api-timeout, api-tries, api-max-wait). */
  api: ApiLimits;
  /** Link to this workflow run (where the job summary is), or null outside Actions. */
  runUrl: string | null;
  repository: { owner: string; repo: string } | null;
  eventName: string;
  /** The pull request under review; null on other events. */
  pullRequest: PullRequestRef | null;
}

export interface ApiLimits {
  /** Time limit of one request, answer included. */
  timeoutMs: number;
  /** Tries of one request (reads and updates; a creation is only repeated after checking it did not arrive). */
  tries: number;
  /** Longest wait for a rate limit or back-off; a longer Retry-After gives up with a rate-limit message. */
  maxWaitMs: number;
}

/** Reads one input by its name in action.yml; '' when not given (as @actions/core's getInput does). */
export type InputReader = (name: string) => string;

export class SettingsError extends Error {
  override name = 'SettingsError';
}

export function readSettings(input: InputReader, env: NodeJS.ProcessEnv): ActionSettings {
  const workspace = realpathSync(env.GITHUB_WORKSPACE || process.cwd());
  const registryRoot = realpathSync(insidePath(workspace, input('registry-path') || '.', 'registry-path'));
  const repoRoot = checkoutOf(registryRoot, workspace);
  const registryDir = relative(repoRoot, registryRoot).split(sep).join('/');
  const optionalPath = (name: string): string | null => {
    const value = input(name).trim();
    return value === '' ? null : resolve(workspace, value);
  };
  const configValue = input('config-file').trim();
  const repository = parseRepository(env.GITHUB_REPOSITORY);
  const eventName = env.GITHUB_EVENT_NAME ?? '';
  const serverUrl = (env.GITHUB_SERVER_URL || 'https://github.com').replace(/\/+$/, '');
  return {
    token: input('token'),
    records: parseRecordChoice(input('records')),
    workspace,
    repoRoot,
    registryRoot,
    registryDir,
    configFile: configValue === '' ? null : insidePath(workspace, configValue, 'config-file'),
    failOn: parseFailOn(input('fail-on')),
    checklistComment: parseBoolean(input('checklist-comment'), 'checklist-comment', true),
    inlineComments: parseBoolean(input('inline-comments'), 'inline-comments', true),
    maxInlineComments: parseCount(input('max-inline-comments'), 'max-inline-comments', 10),
    sarifFile: optionalPath('sarif-file'),
    reportFile: optionalPath('report-file'),
    indexCache: parseIndexCache(input('index-cache'), workspace, env.RUNNER_TEMP),
    apiUrl: env.GITHUB_API_URL || 'https://api.github.com',
    api: {
      timeoutMs: parseSeconds(input('api-timeout'), 'api-timeout', 30) * 1000,
      tries: Math.max(1, parseCount(input('api-tries'), 'api-tries', 3)),
      maxWaitMs: parseSeconds(input('api-max-wait'), 'api-max-wait', 90) * 1000,
    },
    runUrl:
      repository !== null && env.GITHUB_RUN_ID
        ? `${serverUrl}/${repository.owner}/${repository.repo}/actions/runs/${env.GITHUB_RUN_ID}`
        : null,
    repository,
    eventName,
    pullRequest: repository === null ? null : pullRequestOf(env.GITHUB_EVENT_PATH, repository),
  };
}

export function parseRecordChoice(raw: string): RecordChoice {
  const value = raw.trim();
  if (value === '' || value === 'changed') return { kind: 'changed' };
  if (value === 'all') return { kind: 'all' };
  const paths = value
    .split(/\r?\n/)
    .map((p) => p.trim())
    .filter((p) => p !== '');
  return { kind: 'listed', paths };
}

/** The index-cache input: '' -> under RUNNER_TEMP (or none without it), 'none' -> none, else a path. */
export function parseIndexCache(
  raw: string,
  workspace: string,
  runnerTemp: string | undefined,
): string | null {
  const value = raw.trim();
  if (value === 'none') return null;
  if (value === '') return runnerTemp ? join(runnerTemp, 'stereogate', 'index-cache.json') : null;
  return resolve(workspace, value);
}

export function parseFailOn(raw: string): FailOn {
  const value = raw.trim() || 'error';
  if (value === 'error' || value === 'warning' || value === 'never') return value;
  throw new SettingsError(`fail-on must be error, warning or never, not '${value}'`);
}

/** YAML 1.2 core-schema booleans, as @actions/core's getBooleanInput accepts them. */
export function parseBoolean(raw: string, name: string, fallback: boolean): boolean {
  const value = raw.trim();
  if (value === '') return fallback;
  if (['true', 'True', 'TRUE'].includes(value)) return true;
  if (['false', 'False', 'FALSE'].includes(value)) return false;
  throw new SettingsError(`${name} must be true or false, not '${value}'`);
}

export function parseCount(raw: string, name: string, fallback: number): number {
  const value = raw.trim();
  if (value === '') return fallback;
  if (!/^\d+$/.test(value)) throw new SettingsError(`${name} must be a whole number, not '${value}'`);
  return Number(value);
}

/** A positive number of seconds, decimals allowed (short limits keep tests fast). */
export function parseSeconds(raw: string, name: string, fallback: number): number {
  const value = raw.trim();
  if (value === '') return fallback;
  if (!/^\d+(\.\d+)?$/.test(value) || Number(value) <= 0) {
    throw new SettingsError(`${name} must be a positive number of seconds, not '${value}'`);
  }
  return Number(value);
}

function parseRepository(raw: string | undefined): { owner: string; repo: string } | null {
  const match = /^([^/\s]+)\/([^/\s]+)$/.exec(raw ?? '');
  return match === null ? null : { owner: match[1]!, repo: match[2]! };
}

function insidePath(workspace: string, value: string, name: string): string {
  const abs = resolve(workspace, value);
  const rel = relative(workspace, abs);
  if (rel === '..' || rel.startsWith(`..${sep}`) || isAbsolute(rel)) {
    throw new SettingsError(`${name} must be inside the workspace: '${value}'`);
  }
  return abs;
}

/** The nearest folder at or above `dir` (and not above `workspace`) that holds `.git`; else the workspace. */
export function checkoutOf(dir: string, workspace: string): string {
  for (let at = dir; ; at = dirname(at)) {
    if (existsSync(join(at, '.git'))) return at;
    if (at === workspace || dirname(at) === at) return workspace;
  }
}

interface PullRequestPayload {
  pull_request?: {
    number?: unknown;
    changed_files?: unknown;
    base?: { sha?: unknown };
    head?: { sha?: unknown };
  };
}

/** The pull request of a pull_request or pull_request_target event payload; null for other events. */
export function pullRequestOf(
  eventPath: string | undefined,
  repository: { owner: string; repo: string },
): PullRequestRef | null {
  if (!eventPath) return null;
  let payload: PullRequestPayload;
  try {
    payload = JSON.parse(readFileSync(eventPath, 'utf8')) as PullRequestPayload;
  } catch (error) {
    throw new SettingsError(
      `cannot read the event payload ${eventPath}: ${error instanceof Error ? error.message : String(error)}`,
    );
  }
  const pr = payload.pull_request;
  if (pr === undefined || typeof pr.number !== 'number') return null;
  const baseSha = pr.base?.sha;
  const headSha = pr.head?.sha;
  if (typeof baseSha !== 'string' || typeof headSha !== 'string') {
    throw new SettingsError('the pull_request payload has no base or head commit');
  }
  return {
    ...repository,
    number: pr.number,
    baseSha,
    headSha,
    changedFiles: typeof pr.changed_files === 'number' ? pr.changed_files : null,
  };
}
