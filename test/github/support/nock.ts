/** nock set-up shared by the API tests: no real network, a client that records its waits instead of sleeping. */
import nock from 'nock';
import { afterEach, beforeAll } from 'vitest';
import { createClient, type GitHubClient } from '../../../src/github/client.js';

export const API = 'https://api.github.test';

export function useNock(): void {
  beforeAll(() => nock.disableNetConnect());
  afterEach(() => {
    const pending = nock.pendingMocks();
    nock.cleanAll();
    if (pending.length > 0) throw new Error(`nock expectations not met: ${pending.join(', ')}`);
  });
}

export function testClient(): { client: GitHubClient; waits: number[] } {
  const waits: number[] = [];
  const client = createClient({
    baseUrl: API,
    token: 't0ken',
    sleep: async (ms) => {
      waits.push(ms);
    },
  });
  return { client, waits };
}

export { pr } from './results.js';
