/** The action's entry point (bundled into dist/index.js): read the settings, review, fail by the threshold. */
import * as core from '@actions/core';
import { createClient } from '../github/client.js';
import { engine } from './engine.js';
import { review } from './review.js';
import { coreRunner } from './runner.js';
import { readSettings } from './settings.js';

export async function run(): Promise<void> {
  try {
    const settings = readSettings((name) => core.getInput(name), process.env);
    if (settings.token !== '') core.setSecret(settings.token);
    const onRetry = (r: { method: string; path: string; status: number | null; delayMs: number }): void =>
      core.info(
        `GitHub API ${r.method} ${r.path} answered ${r.status ?? 'nothing'}; trying again in ${Math.ceil(r.delayMs / 1000)} s.`,
      );
    const client =
      settings.token === ''
        ? null
        : createClient({ baseUrl: settings.apiUrl, token: settings.token, onRetry });
    const outcome = await review(settings, engine, client, coreRunner);
    if (outcome.failure !== null) core.setFailed(outcome.failure);
  } catch (error) {
    core.setFailed(error instanceof Error ? error.message : String(error));
  }
}

await run();
