/** The action's entry point (bundled into dist/index.js): read the settings, review, fail by the threshold. */
import * as core from '@actions/core';
import { engine } from './engine.js';
import { clientFor } from './github-client.js';
import { review } from './review.js';
import { coreRunner } from './runner.js';
import { readSettings } from './settings.js';

export async function run(): Promise<void> {
  try {
    const settings = readSettings((name) => core.getInput(name), process.env);
    if (settings.token !== '') core.setSecret(settings.token);
    const outcome = await review(settings, engine, clientFor(settings, coreRunner), coreRunner);
    if (outcome.failure !== null) core.setFailed(outcome.failure);
  } catch (error) {
    core.setFailed(error instanceof Error ? error.message : String(error));
  }
}

await run();
