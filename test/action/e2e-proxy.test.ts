/**
 * The bundled action (dist/index.js) on a self-hosted runner behind a corporate proxy: HTTPS_PROXY names a CONNECT
 * proxy on 127.0.0.1, the API host (api.github.test) resolves nowhere, so the review can only be posted through the
 * proxy; the API's certificate is a throw-away one trusted through NODE_EXTRA_CA_CERTS, as a company CA would be.
 * Also: a first creation answered with 502 after it was made leaves one checklist comment, not two.
 */
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tempRepo, type TempRepo } from '../github/support/git.js';
import { startFakeGitHub, type FakeGitHub } from './support/fake-github.js';
import { runnerEnv } from './support/runner-env.js';
import { startConnectProxy, type ConnectProxy } from './support/proxy.js';
import { selfSignedCert } from './support/tls.js';

const run = promisify(execFile);
const bundle = resolve('dist/index.js');

// Ethanol has no stereogenic unit (common knowledge, from memory), so it cannot be a single enantiomer.
const ETHANOL_WRONG =
  'id: LX-00003\nname: ethanol\nstructure:\n  smiles: "CCO"\nstereo:\n  form: single-enantiomer\n';

describe.skipIf(!existsSync(bundle))('dist/index.js behind an HTTPS proxy', () => {
  let repo: TempRepo;
  let gh: FakeGitHub;
  let proxy: ConnectProxy;
  let dir: string;
  let port: string;

  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'stereogate-e2e-proxy-'));
    const cert = selfSignedCert('api.github.test');
    writeFileSync(join(dir, 'ca.pem'), cert.cert);
    gh = await startFakeGitHub('larkspur', 'registry', 7, { tls: cert });
    port = new URL(gh.url).port;
    proxy = await startConnectProxy(Number(port));
    repo = tempRepo();
    repo.write({ 'README.md': '# Larkspur Chemistry Lab registry\n' });
  });
  afterAll(async () => {
    await proxy?.close();
    await gh?.close();
    repo?.dispose();
    rmSync(dir, { recursive: true, force: true });
  });

  it('posts through the proxy, once, although the first creation was answered with 502', async () => {
    const base = repo.commit('registry');
    repo.write({ 'compounds/LX-00003.yaml': ETHANOL_WRONG });
    const head = repo.commit('add LX-00003');
    const patch = repo.git('diff', `${base}...${head}`, '--', 'compounds/LX-00003.yaml').split('\n').slice(4);
    gh.files = [{ filename: 'compounds/LX-00003.yaml', status: 'added', patch: patch.join('\n') }];
    gh.faults.push({ route: 'POST /issues/7/comments', kind: 'status-after-create' });

    const event = join(dir, 'event.json');
    writeFileSync(
      event,
      JSON.stringify({
        pull_request: { number: 7, changed_files: 1, base: { sha: base }, head: { sha: head } },
      }),
    );
    const summary = join(dir, 'summary.md');
    const outputs = join(dir, 'outputs');
    writeFileSync(summary, '');
    writeFileSync(outputs, '');
    const env = runnerEnv(
      { dir, workspace: repo.dir, event, outputs, summary, apiUrl: `https://api.github.test:${port}` },
      { HTTPS_PROXY: proxy.url, NODE_EXTRA_CA_CERTS: join(dir, 'ca.pem') },
    );
    env['INPUT_API-TIMEOUT'] = '5';
    const done = await run(process.execPath, [bundle], { cwd: repo.dir, env }).catch(
      (e: { code?: number; stdout?: string; stderr?: string }) => e,
    );
    const stdout = `${done.stdout ?? ''}${done.stderr ?? ''}`;

    expect(gh.unexpected).toEqual([]);
    expect(stdout).toContain(`go through the proxy ${proxy.url}`);
    expect(new Set(proxy.connects)).toEqual(new Set([`api.github.test:${port}`]));
    expect(gh.issueComments).toHaveLength(1);
    expect(gh.reviewComments).toHaveLength(1);
    expect(gh.reviewComments[0]!.body).toContain('```suggestion\n  form: achiral\n```');
    expect(readFileSync(summary, 'utf8')).toContain('Checklist comment created');
    expect(gh.requests.every((r) => r.authorization === 'Bearer test-token')).toBe(true);
  });
});
