/** The GitHub client the action uses, built from the settings: time limit, tries, longest wait, proxy, log lines. */
import { createClient, type GitHubClient } from '../github/client.js';
import type { Runner } from './ports.js';
import type { ActionSettings } from './settings.js';

/** null when no token is given (nothing is asked of the API). */
export function clientFor(settings: ActionSettings, runner: Pick<Runner, 'info'>): GitHubClient | null {
  if (settings.token === '') return null;
  const client = createClient({
    baseUrl: settings.apiUrl,
    token: settings.token,
    timeoutMs: settings.api.timeoutMs,
    retry: { maxTries: settings.api.tries, maxDelayMs: settings.api.maxWaitMs },
    onRetry: (r) =>
      runner.info(
        `GitHub API ${r.method} ${r.path}: ${r.status === null ? r.kind : `HTTP ${r.status} (${r.kind})`}; ` +
          `trying again in ${Math.ceil(r.delayMs / 1000)} s.`,
      ),
  });
  if (client.proxy !== null) runner.info(`GitHub API requests go through the proxy ${client.proxy}.`);
  return client;
}
