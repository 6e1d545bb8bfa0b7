/**
 * The environment the GitHub runner gives the bundled action on a pull_request event: the GITHUB_* variables,
 * and INPUT_<NAME> (upper case, spaces to '_', dashes kept) for every input of action.yml, defaults included.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parse } from 'yaml';

export interface RunnerPaths {
  /** scratch folder: HOME, RUNNER_TEMP and the SARIF and report files */
  dir: string;
  /** the checked-out repository (GITHUB_WORKSPACE) */
  workspace: string;
  event: string;
  outputs: string;
  summary: string;
  apiUrl: string;
}

export function runnerEnv(p: RunnerPaths, extra: Record<string, string> = {}): Record<string, string> {
  const env: Record<string, string> = {
    PATH: process.env.PATH ?? '',
    HOME: p.dir,
    GITHUB_ACTIONS: 'true',
    GITHUB_EVENT_NAME: 'pull_request',
    GITHUB_EVENT_PATH: p.event,
    GITHUB_REPOSITORY: 'larkspur/registry',
    GITHUB_WORKSPACE: p.workspace,
    GITHUB_API_URL: p.apiUrl,
    GITHUB_OUTPUT: p.outputs,
    GITHUB_STEP_SUMMARY: p.summary,
    RUNNER_TEMP: p.dir,
  };
  const action = parse(readFileSync('action.yml', 'utf8')) as {
    inputs: Record<string, { default?: string }>;
  };
  for (const [name, input] of Object.entries(action.inputs)) {
    env[`INPUT_${name.replace(/ /g, '_').toUpperCase()}`] =
      name === 'token' ? 'test-token' : (input.default ?? '');
  }
  env['INPUT_SARIF-FILE'] = join(p.dir, 'out.sarif');
  env['INPUT_REPORT-FILE'] = join(p.dir, 'report.md');
  return { ...env, ...extra };
}
