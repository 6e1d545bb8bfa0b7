/** The action settings the review tests start from: pull request 7 of larkspur/registry, every output on. */
import { join } from 'node:path';
import type { ActionSettings } from '../../../src/action/settings.js';
import { pr } from '../../github/support/results.js';

export function actionSettings(workspace: string, over: Partial<ActionSettings> = {}): ActionSettings {
  return {
    token: 't0ken',
    records: { kind: 'changed' },
    workspace,
    repoRoot: workspace,
    registryRoot: workspace,
    registryDir: '',
    configFile: null,
    failOn: 'error',
    checklistComment: true,
    inlineComments: true,
    maxInlineComments: 10,
    sarifFile: join(workspace, 'out', 'stereogate.sarif'),
    reportFile: join(workspace, 'out', 'report.md'),
    indexCache: null,
    apiUrl: 'https://api.github.test',
    api: { timeoutMs: 5000, tries: 3, maxWaitMs: 90_000 },
    runUrl: 'https://github.test/larkspur/registry/actions/runs/1',
    repository: { owner: 'larkspur', repo: 'registry' },
    eventName: 'pull_request',
    pullRequest: pr,
    ...over,
  };
}
