/**
 * The action against a real, imperfect GitHub: a fake GitHub on 127.0.0.1 that fails the way the real one does
 * (5xx or a dropped connection after creating, a request that never gets an answer, a long Retry-After, a planted
 * marker, two overlapping runs, an error echoing the token, a proxy in between). Each run goes through the real
 * client over real sockets with short time limits (api-timeout 1.5 s), so the whole suite takes seconds.
 * What must hold every time: at most one checklist comment, no duplicate inline comment, and the result — outputs,
 * report file, job summary — written whatever GitHub did.
 */
import { mkdtempSync, readFileSync, realpathSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, beforeEach, describe, expect, it } from 'vitest';
import { engine as realEngine } from '../../src/action/engine.js';
import { clientFor } from '../../src/action/github-client.js';
import { review } from '../../src/action/review.js';
import type { ActionSettings } from '../../src/action/settings.js';
import { createClient } from '../../src/github/client.js';
import { transportFor } from '../../src/github/transport.js';
import { escapeMarkdown } from '../../src/report/escape.js';
import { finding, record, result } from '../github/support/results.js';
import { startFakeGitHub, type FakeGitHub } from './support/fake-github.js';
import { recordingRunner, fakeEngine } from './support/fakes.js';
import { actionSettings } from './support/settings.js';
import { startConnectProxy } from './support/proxy.js';
import { selfSignedCert } from './support/tls.js';

const workspace = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-faults-')));
afterAll(() => rmSync(workspace, { recursive: true, force: true }));

const MARKER = '<!-- stereogate-checklist -->';
const TOKEN = 'ghs_Larkspur_test_token_0123456789';
const audit = result([
  record('compounds/LX-00001.yaml', [finding('error', 6)]),
  record('compounds/LX-00002.yaml', [finding('warning', 2)], 'LX-00002'),
]);
const files = [
  {
    filename: 'compounds/LX-00001.yaml',
    status: 'modified',
    patch: '@@ -5,2 +5,2 @@\n stereo:\n-  form: achiral\n+  form: racemate',
  },
  { filename: 'compounds/LX-00002.yaml', status: 'added', patch: '@@ -0,0 +1,3 @@\n+id: LX-00002\n+a\n+b' },
];

function settings(apiUrl: string, over: Partial<ActionSettings> = {}): ActionSettings {
  return actionSettings(workspace, {
    token: TOKEN,
    sarifFile: join(workspace, 'out.sarif'),
    reportFile: join(workspace, 'report.md'),
    apiUrl,
    api: { timeoutMs: 1500, tries: 3, maxWaitMs: 2000 },
    ...over,
  });
}

let gh: FakeGitHub;
beforeEach(async () => {
  gh = await startFakeGitHub('larkspur', 'registry', 7);
  gh.files = files;
});
afterEach(async () => {
  await gh.close();
});

async function runOnce(over: Partial<ActionSettings> = {}) {
  const s = settings(gh.url, over);
  const runner = recordingRunner();
  const outcome = await review(s, fakeEngine(audit), clientFor(s, runner), runner);
  return { runner, outcome, summary: runner.summaries.join('') };
}

const posts = (path: string): number =>
  gh.requests.filter((r) => r.method === 'POST' && r.path.endsWith(path)).length;

/** What must hold after every run: the result is never lost. */
function expectResultKept(run: Awaited<ReturnType<typeof runOnce>>): void {
  expect(run.runner.outputs.errors).toBe(1);
  expect(run.runner.summaries[0]).toContain(MARKER); // the checklist, written before anything was posted
  expect(readFileSync(join(workspace, 'report.md'), 'utf8')).toContain(MARKER);
  expect(run.outcome.failure).toMatch(/1 error/);
  expect(gh.unexpected).toEqual([]);
}

describe('the action against an imperfect GitHub', () => {
  it('a 502 after the checklist comment was created: looks, finds it, posts no second one', async () => {
    gh.faults.push({ route: 'POST /issues/7/comments', kind: 'status-after-create' });
    const run = await runOnce();
    expectResultKept(run);
    expect(gh.issueComments).toHaveLength(1);
    expect(posts('/issues/7/comments')).toBe(1);
    expect(run.summary).toContain('Checklist comment created');
  });

  it('a connection reset after the checklist comment was created: one comment', async () => {
    gh.faults.push({ route: 'POST /issues/7/comments', kind: 'reset-after-create' });
    const run = await runOnce();
    expectResultKept(run);
    expect(gh.issueComments).toHaveLength(1);
    expect(posts('/issues/7/comments')).toBe(1);
  });

  it('a POST that never gets an answer times out, is looked for, and is sent once more only when absent', async () => {
    gh.faults.push({ route: 'POST /issues/7/comments', kind: 'stall' });
    const run = await runOnce();
    expectResultKept(run);
    expect(gh.issueComments).toHaveLength(1);
    expect(posts('/issues/7/comments')).toBe(2);

    // Created, then no answer: found on the next look, not sent again.
    gh.issueComments.length = 0;
    gh.faults.push({ route: 'POST /issues/7/comments', kind: 'stall-after-create' });
    const before = posts('/issues/7/comments');
    const again = await runOnce();
    expectResultKept(again);
    expect(gh.issueComments).toHaveLength(1);
    expect(posts('/issues/7/comments') - before).toBe(1);
  });

  it('a stalled or failed inline comment is not posted twice', async () => {
    gh.faults.push({ route: 'POST /pulls/7/comments', kind: 'stall-after-create' });
    gh.faults.push({ route: 'POST /pulls/7/comments', kind: 'status-after-create' });
    const run = await runOnce();
    expectResultKept(run);
    expect(gh.reviewComments.map((c) => [c.path, c.line]).sort()).toEqual([
      ['compounds/LX-00001.yaml', 6],
      ['compounds/LX-00002.yaml', 2],
    ]);
    expect(run.summary).toMatch(/2 inline comments posted/);
  });

  it('a 403 with a long Retry-After is reported as a rate limit, not a read-only token, without waiting for it', async () => {
    gh.faults.push({ route: 'POST /issues/7/comments', kind: 'rate-limit', retryAfter: 3600 });
    const started = Date.now();
    const run = await runOnce({ inlineComments: false });
    expectResultKept(run);
    expect(Date.now() - started).toBeLessThan(20_000); // did not sit out the hour (a bound, not a timing)
    expect(gh.issueComments).toHaveLength(0);
    const said = run.runner.warnings.join('\n');
    expect(said).toMatch(/rate limit/);
    expect(said).toMatch(/retry after 3600 s/);
    expect(said).toMatch(/not a read-only token/);
    expect(said).not.toMatch(/may not write/);
  });

  it('a comment by a person carrying the marker is not adopted: stereogate writes its own', async () => {
    gh.plant(`${MARKER}\nI approve this. — Mallory`);
    const run = await runOnce();
    expectResultKept(run);
    const planted = gh.issueComments.find((c) => c.user.type === 'User')!;
    expect(planted.body).toBe(`${MARKER}\nI approve this. — Mallory`);
    const mine = gh.issueComments.filter((c) => c.user.type === 'Bot');
    expect(mine).toHaveLength(1);
    expect(gh.requests.some((r) => r.method === 'PATCH')).toBe(false);
  });

  it('with a personal access token its own (non-bot) comments are still found; a planted one still is not', async () => {
    gh.tokenUser = 'larkspur-registrar';
    gh.plant(`${MARKER}\nplanted`);
    const first = await runOnce();
    expectResultKept(first);
    const second = await runOnce();
    expect(second.summary).toContain('Checklist comment unchanged');
    expect(gh.issueComments.filter((c) => c.user.login === 'larkspur-registrar')).toHaveLength(1);
    expect(gh.issueComments.find((c) => c.user.login === 'mallory')!.body).toBe(`${MARKER}\nplanted`);
    expect(gh.reviewComments).toHaveLength(2); // not posted again on the second run
    expect(second.summary).toMatch(/2 already there/);
  });

  it('two overlapping runs end with one checklist comment and one inline comment per line', async () => {
    // Both runs list the comments before either creates one (the first lists are answered together), so both
    // create; creations answered late, so each run's second look may or may not see the other's.
    gh.faults.push({ route: 'GET /issues/7/comments', kind: 'barrier', times: 2 });
    gh.faults.push({ route: 'GET /pulls/7/comments', kind: 'barrier', times: 2 });
    gh.faults.push({ route: 'POST /issues/7/comments', kind: 'slow-create', delayMs: 200, times: 2 });
    gh.faults.push({ route: 'POST /pulls/7/comments', kind: 'slow-create', delayMs: 200, times: 4 });
    const [a, b] = await Promise.all([runOnce(), runOnce()]);
    expectResultKept(a);
    expectResultKept(b);
    expect(posts('/issues/7/comments')).toBe(2); // both did create…
    expect(gh.issueComments).toHaveLength(1); // …and one was deleted again
    const keys = gh.reviewComments.map((c) => `${c.path}:${c.line}`);
    expect(new Set(keys).size).toBe(keys.length);
    expect(keys.sort()).toEqual(['compounds/LX-00001.yaml:6', 'compounds/LX-00002.yaml:2']);
    // A third run finds its comment and changes nothing.
    const c = await runOnce();
    expect(c.summary).toContain('Checklist comment unchanged');
    expect(gh.issueComments).toHaveLength(1);
  });

  it('a token echoed in an error message reaches neither the summary nor a comment, escaped or not', async () => {
    gh.faults.push({ route: 'GET /issues/7/comments', kind: 'echo-token' });
    const run = await runOnce({ inlineComments: false });
    expectResultKept(run);
    expect(run.summary).toMatch(/Could not post the checklist comment/);
    for (const text of [run.summary, ...run.runner.warnings, ...gh.issueComments.map((c) => c.body)]) {
      expect(text).not.toContain(TOKEN);
      expect(text).not.toContain(escapeMarkdown(TOKEN));
      expect(text).not.toContain('Larkspur_test_token');
    }
    expect(run.summary).toMatch(/Bearer (\\\*){3}/); // the mask, Markdown-escaped
  });

  it("a big pull request: comments within GitHub's size limits, the summary and report file hold everything", async () => {
    // 300 records with findings, one finding 79,677 characters long (the size GitHub once refused).
    const records = Array.from({ length: 300 }, (_, i) => {
      const id = `LX-${String(i + 1).padStart(5, '0')}`;
      const message =
        i === 0
          ? `declared racemate ${'but the structure is achiral '.repeat(2748)}`.slice(0, 79_677)
          : `declared racemate, but the structure is achiral; record ${id} ${'x'.repeat(200)}`;
      return record(`compounds/${id}.yaml`, [finding('error', 6, { message })], id);
    });
    const big = result(records);
    gh.files = [
      {
        filename: 'compounds/LX-00001.yaml',
        status: 'added',
        patch: '@@ -0,0 +1,7 @@\n+a\n+b\n+c\n+d\n+e\n+f\n+g',
      },
    ];
    const s = settings(gh.url);
    const runner = recordingRunner();
    const engine = { ...realEngine, audit: async () => big, recordDirs: async () => ['compounds'] };
    await review(s, engine, clientFor(s, runner), runner);
    expect(gh.issueComments).toHaveLength(1);
    expect(gh.issueComments[0]!.body.length).toBeLessThanOrEqual(65_536);
    expect(gh.reviewComments).toHaveLength(1);
    expect(gh.reviewComments[0]!.body.length).toBeLessThanOrEqual(65_536);
    expect(gh.reviewComments[0]!.body).toContain('whole in the checklist');
    const report = readFileSync(join(workspace, 'report.md'), 'utf8');
    const summary = runner.summaries.join('');
    for (const text of [report, summary]) {
      expect(text).toMatch(/LX.00300/); // the last record, whatever the escaping of '-'
      expect(text).toContain('but the structure is achiral '.repeat(100));
    }
    expect(Buffer.byteLength(summary)).toBeLessThanOrEqual(1024 * 1024);
  });

  it('goes through an HTTPS proxy (HTTPS_PROXY) with CONNECT, and straight out for hosts in NO_PROXY', async () => {
    const cert = selfSignedCert('api.github.test');
    const tlsGh = await startFakeGitHub('larkspur', 'registry', 7, { tls: cert });
    tlsGh.files = files;
    const port = new URL(tlsGh.url).port;
    const proxy = await startConnectProxy(Number(port));
    const saved = { ...process.env };
    try {
      process.env.HTTPS_PROXY = proxy.url;
      delete process.env.https_proxy;
      delete process.env.NO_PROXY;
      delete process.env.no_proxy;
      // api.github.test resolves nowhere: the request can only arrive through the proxy.
      const apiUrl = `https://api.github.test:${port}`;
      const s = settings(apiUrl);
      const client = createClient({
        baseUrl: apiUrl,
        token: TOKEN,
        timeoutMs: 2000,
        transport: transportFor(new URL(apiUrl), { ca: cert.cert }),
      });
      expect(client.proxy).toBe(proxy.url);
      const runner = recordingRunner();
      await review(s, fakeEngine(audit), client, runner);
      expect(runner.summaries.join('')).toContain('Checklist comment created');
      expect(tlsGh.issueComments).toHaveLength(1);
      expect(tlsGh.reviewComments).toHaveLength(2);
      expect(proxy.connects.length).toBeGreaterThan(0);
      expect(new Set(proxy.connects)).toEqual(new Set([`api.github.test:${port}`]));

      // NO_PROXY names the host: no proxy is used (and the made-up host cannot be reached straight).
      process.env.NO_PROXY = 'github.test';
      expect(transportFor(new URL(apiUrl)).proxy).toBeNull();
      // Lower-case https_proxy is honoured too (the toolkit reads it first).
      delete process.env.NO_PROXY;
      delete process.env.HTTPS_PROXY;
      process.env.https_proxy = proxy.url;
      expect(transportFor(new URL(apiUrl)).proxy).toBe(proxy.url);
    } finally {
      for (const k of ['HTTPS_PROXY', 'https_proxy', 'NO_PROXY', 'no_proxy']) {
        if (saved[k] === undefined) delete process.env[k];
        else process.env[k] = saved[k];
      }
      await proxy.close();
      await tlsGh.close();
    }
  });
});
