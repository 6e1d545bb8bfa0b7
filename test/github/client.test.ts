import nock from 'nock';
import { describe, expect, it } from 'vitest';
import { createClient, GitHubApiError, nextLink } from '../../src/github/client.js';
import { API, testClient, useNock } from './support/nock.js';

useNock();

describe('client', () => {
  it('sends the token and GitHub headers, and parses JSON', async () => {
    nock(API, { reqheaders: { authorization: 'Bearer t0ken', accept: 'application/vnd.github+json' } })
      .get('/repos/o/r')
      .reply(200, { full_name: 'o/r' });
    const { client } = testClient();
    const answer = await client.request<{ full_name: string }>('GET', '/repos/o/r');
    expect(answer.data.full_name).toBe('o/r');
  });

  // GitHub REST docs, "Using pagination in the REST API": follow the Link header's rel="next" (RFC 8288).
  it('follows Link rel="next" across pages', async () => {
    nock(API)
      .get('/items')
      .query({ per_page: '100' })
      .reply(200, [1, 2], {
        link: `<${API}/items?per_page=100&page=2>; rel="next", <${API}/items?per_page=100&page=3>; rel="last"`,
      })
      .get('/items')
      .query({ per_page: '100', page: '2' })
      .reply(200, [3], { link: `<${API}/items?per_page=100&page=3>; rel="next"` })
      .get('/items')
      .query({ per_page: '100', page: '3' })
      .reply(200, [4]);
    const { client } = testClient();
    expect(await client.paginate<number>('/items')).toEqual([1, 2, 3, 4]);
  });

  it('retries a 502 and then succeeds', async () => {
    nock(API).get('/x').reply(502, 'Bad Gateway').get('/x').reply(200, { ok: true });
    const { client, waits } = testClient();
    expect((await client.request<{ ok: boolean }>('GET', '/x')).data.ok).toBe(true);
    expect(waits).toEqual([1000]);
  });

  it('waits Retry-After on a secondary rate limit, then succeeds', async () => {
    nock(API)
      .post('/c', { body: 'hi' })
      .reply(403, { message: 'You have exceeded a secondary rate limit.' }, { 'retry-after': '2' })
      .post('/c', { body: 'hi' })
      .reply(201, { id: 1 });
    const { client, waits } = testClient();
    expect((await client.request<{ id: number }>('POST', '/c', { body: 'hi' })).status).toBe(201);
    expect(waits).toEqual([2000]);
  });

  it('gives up after three tries with an error that carries the status', async () => {
    nock(API).get('/x').times(3).reply(503, { message: 'down' });
    const { client, waits } = testClient();
    const error = await client.request('GET', '/x').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(GitHubApiError);
    expect((error as GitHubApiError).status).toBe(503);
    expect(waits).toEqual([1000, 2000]);
  });

  it('does not retry a 403 that is a permission refusal', async () => {
    nock(API).post('/c').reply(403, { message: 'Resource not accessible by integration' });
    const { client, waits } = testClient();
    const error = (await client.request('POST', '/c', {}).catch((e: unknown) => e)) as GitHubApiError;
    expect(error.status).toBe(403);
    expect(error.message).toContain('Resource not accessible by integration');
    expect(waits).toEqual([]);
  });

  // Issue 10: a POST is never re-sent blindly; after a 5xx the caller looks first (it may have been created).
  it('does not repeat a POST after a 502, and says the outcome is unknown', async () => {
    nock(API).post('/c').reply(502, 'Bad Gateway');
    const { client, waits } = testClient();
    const error = (await client.request('POST', '/c', {}).catch((e: unknown) => e)) as GitHubApiError;
    expect(error.kind).toBe('server');
    expect(error.maybeDone).toBe(true);
    expect(waits).toEqual([]);
  });

  it('tells a long rate limit from a refusal and keeps the token out of the error', async () => {
    nock(API)
      .post('/c')
      .reply(403, { message: 'secondary rate limit for Bearer t0ken' }, { 'retry-after': '3600' });
    const { client, waits } = testClient();
    const error = (await client.request('POST', '/c', {}).catch((e: unknown) => e)) as GitHubApiError;
    expect(error.kind).toBe('rate-limit');
    expect(error.retryAfterMs).toBe(3_600_000);
    expect(error.message).toMatch(/rate limit \(not a permission problem\); GitHub asks to wait 3600 s/);
    expect(error.message + error.body).not.toContain('t0ken');
    expect(waits).toEqual([]);
  });

  it('never sends the token to another origin (a Link header pointing elsewhere)', async () => {
    nock(API)
      .get('/items')
      .query(true)
      .reply(200, [1], { link: '<https://elsewhere.test/steal>; rel="next"' });
    const { client } = testClient();
    await expect(client.paginate('/items')).rejects.toThrow(/another origin/);
  });

  it('keeps a path prefix of a GitHub Enterprise API URL', async () => {
    nock('https://ghe.test').get('/api/v3/repos/o/r').reply(200, {});
    const client = createClient({ baseUrl: 'https://ghe.test/api/v3/', token: 't' });
    expect((await client.request('GET', '/repos/o/r')).status).toBe(200);
  });
});

describe('nextLink', () => {
  it('finds rel="next" among several links and returns null without one', () => {
    expect(nextLink('<https://a/p2>; rel="next", <https://a/p9>; rel="last"')).toBe('https://a/p2');
    expect(nextLink('<https://a/p1>; rel="prev"')).toBeNull();
    expect(nextLink(null)).toBeNull();
  });
});
