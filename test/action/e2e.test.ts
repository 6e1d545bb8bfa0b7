/**
 * The one test that drives the bundled action (dist/index.js) the way the Actions runner does: INPUT_* variables
 * (the runner fills in action.yml defaults), GITHUB_EVENT_PATH with a pull_request payload, GITHUB_WORKSPACE
 * holding a git checkout of a small registry, GITHUB_API_URL pointing at a loopback server, GITHUB_OUTPUT and
 * GITHUB_STEP_SUMMARY as files. It runs twice: after a second push the checklist comment is updated, not repeated.
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

const run = promisify(execFile);
const bundle = resolve('dist/index.js');
const MARKER = '<!-- stereogate-checklist -->';

if (!existsSync(bundle))
  console.warn('e2e: dist/index.js does not exist yet (run npm run bundle); the end-to-end test is skipped.');

const record = (id: string, name: string, smiles: string, form: string): string =>
  `id: ${id}\nname: "${name}"\nstructure:\n  smiles: "${smiles}"\nstereo:\n  form: ${form}\n`;

// Chemistry of the records (the action test only needs some records to be wrong):
// (2R,3S)-tartaric acid is meso: two stereocentres of opposite label in a constitutionally symmetric molecule
// ("meso-compound" in IUPAC Basic Terminology of Stereochemistry, Moss 1996, from memory; the CIP labels R,S
// checked with RDKit via @rdkit/rdkit), so it cannot be a racemate.
// Ethanol has no stereogenic unit (common knowledge, from memory), so it cannot be a single enantiomer.
const L_TARTARIC = record(
  'LX-00001',
  '(2S,3S)-tartaric acid',
  'OC(=O)[C@@H](O)[C@H](O)C(=O)O',
  'single-enantiomer',
);
const MESO_AS_RACEMATE = record(
  'LX-00002',
  'tartaric acid @octocat ![x](https://evil.example/x.png)',
  'OC(=O)[C@@H](O)[C@@H](O)C(=O)O',
  'racemate',
);
const ETHANOL_WRONG = record('LX-00003', 'ethanol', 'CCO', 'single-enantiomer');
const ETHANOL_RIGHT = record('LX-00003', 'ethanol', 'CCO', 'achiral');

// The action declares GitHub's node24 runtime; the tests run on the machine's Node (20). With STEREOGATE_NODE24
// pointing at a Node 24 binary (.ci/run fetches one), the bundle is driven by both.
const node24 = process.env.STEREOGATE_NODE24;
if (process.env.STEREOGATE_REQUIRE_NODE24 === '1' && !(node24 && existsSync(node24)))
  throw new Error('e2e: STEREOGATE_NODE24 does not name a Node 24 binary (required under .ci/run)');
if (!node24)
  console.warn('[stereogate tests] e2e: STEREOGATE_NODE24 not set; the bundle runs on this Node only.');
const runtimes: [string, string][] = [[`Node ${process.versions.node}`, process.execPath]];
if (node24 && existsSync(node24)) runtimes.push(['Node 24 (STEREOGATE_NODE24)', node24]);

describe.skipIf(!existsSync(bundle)).each(runtimes)(
  'dist/index.js on a pull request, as the runner runs it, on %s',
  (_label, node) => {
    let repo: TempRepo;
    let gh: FakeGitHub;
    let dir: string;
    let base: string;

    beforeAll(async () => {
      dir = mkdtempSync(join(tmpdir(), 'stereogate-e2e-'));
      repo = tempRepo();
      repo.write({
        'compounds/LX-00001.yaml': L_TARTARIC,
        'README.md': '# Larkspur Chemistry Lab registry\n',
      });
      base = repo.commit('registry');
      gh = await startFakeGitHub('larkspur', 'registry', 7);
    });
    afterAll(async () => {
      await gh?.close();
      repo?.dispose();
      rmSync(dir, { recursive: true, force: true });
    });

    /** Lists the pull request's files with their patches, as GET /pulls/{n}/files does. */
    function showPullRequest(head: string): void {
      const names = repo.git('diff', '--name-status', `${base}...${head}`).trim().split('\n');
      gh.files = names.map((line) => {
        const [code, filename] = line.split('\t') as [string, string];
        const patch = repo.git('diff', `${base}...${head}`, '--', filename).split('\n').slice(4).join('\n');
        return { filename, status: code === 'A' ? 'added' : 'modified', patch };
      });
    }

    async function runAction(
      head: string,
    ): Promise<{ code: number; stdout: string; outputs: string; summary: string }> {
      const event = join(dir, 'event.json');
      writeFileSync(
        event,
        JSON.stringify({
          action: 'synchronize',
          number: 7,
          pull_request: {
            number: 7,
            changed_files: gh.files.length,
            base: { sha: base },
            head: { sha: head },
          },
        }),
      );
      const outputs = join(dir, `output-${head}`);
      const summary = join(dir, `summary-${head}`);
      writeFileSync(outputs, '');
      writeFileSync(summary, '');
      const env = runnerEnv(
        { dir, workspace: repo.dir, event, outputs, summary, apiUrl: gh.url },
        { GITHUB_SERVER_URL: 'https://github.test', GITHUB_RUN_ID: '99' },
      );
      try {
        const done = await run(node, [bundle], { cwd: repo.dir, env, maxBuffer: 64 * 1024 * 1024 });
        return {
          code: 0,
          stdout: done.stdout,
          outputs: readFileSync(outputs, 'utf8'),
          summary: readFileSync(summary, 'utf8'),
        };
      } catch (error) {
        const e = error as { code?: number; stdout?: string; stderr?: string };
        if (typeof e.code !== 'number') throw error;
        return {
          code: e.code,
          stdout: `${e.stdout ?? ''}${e.stderr ?? ''}`,
          outputs: readFileSync(outputs, 'utf8'),
          summary: readFileSync(summary, 'utf8'),
        };
      }
    }

    it('runs on the runtime it names', async () => {
      const { stdout } = await run(node, ['--version']);
      expect(stdout.trim()).toBe(node === process.execPath ? process.version : stdout.trim());
      if (node !== process.execPath) expect(stdout).toMatch(/^v24\./);
    });

    it('posts one checklist comment and inline comments, then updates that comment on the next push', async () => {
      repo.write({ 'compounds/LX-00002.yaml': MESO_AS_RACEMATE, 'compounds/LX-00003.yaml': ETHANOL_WRONG });
      const head1 = repo.commit('add LX-00002 and LX-00003');
      showPullRequest(head1);
      const first = await runAction(head1);

      expect(gh.unexpected).toEqual([]);
      expect(gh.requests.every((r) => r.authorization === 'Bearer test-token')).toBe(true);
      expect(first.code, first.stdout).toBe(1); // errors and fail-on: error
      // Workflow commands (GitHub docs, "Workflow commands for GitHub Actions": ::error file=…,line=…::message).
      expect(first.stdout).toMatch(/^::error title=[^\n]*,file=compounds\/LX-00002\.yaml,line=\d+::/m);
      expect(first.stdout).toMatch(/^::error title=[^\n]*,file=compounds\/LX-00003\.yaml,line=\d+::/m);
      expect(first.outputs).toMatch(/^errors<<.*\n[1-9]\d*\n/m);
      expect(first.summary).toContain(MARKER);
      expect(first.summary).toContain('Checklist comment created');
      expect(JSON.parse(readFileSync(join(dir, 'out.sarif'), 'utf8')).version).toBe('2.1.0');

      expect(gh.issueComments).toHaveLength(1);
      const comment = gh.issueComments[0]!.body;
      expect(comment).toContain(MARKER);
      expect(comment).toMatch(/LX\\?-00002/); // ids are escaped like all record text (a '-' needs no escape)
      expect(comment).toMatch(/LX\\?-00003/);
      expect(comment).not.toMatch(/@octocat|!\[x\]/); // the name from the record is escaped
      const formLine = (text: string): number =>
        text.split('\n').findIndex((l) => l.startsWith('  form:')) + 1;
      expect(gh.reviewComments.map((c) => [c.path, c.line]).sort()).toEqual([
        ['compounds/LX-00002.yaml', formLine(MESO_AS_RACEMATE)],
        ['compounds/LX-00003.yaml', formLine(ETHANOL_WRONG)],
      ]);
      expect(gh.reviewComments.every((c) => c.commit_id === head1)).toBe(true);
      const inlineBefore = gh.reviewComments.length;

      // The submitter fixes LX-00003 and pushes again.
      repo.write({ 'compounds/LX-00003.yaml': ETHANOL_RIGHT });
      const head2 = repo.commit('fix LX-00003');
      showPullRequest(head2);
      const posts = gh.requests.filter(
        (r) => r.method === 'POST' && r.path.endsWith('/issues/7/comments'),
      ).length;
      const second = await runAction(head2);

      expect(gh.unexpected).toEqual([]);
      expect(second.code, second.stdout).toBe(1); // LX-00002 is still wrong
      expect(gh.issueComments).toHaveLength(1);
      expect(
        gh.requests.filter((r) => r.method === 'POST' && r.path.endsWith('/issues/7/comments')).length,
      ).toBe(posts);
      expect(
        gh.requests.some(
          (r) => r.method === 'PATCH' && r.path.endsWith(`/issues/comments/${gh.issueComments[0]!.id}`),
        ),
      ).toBe(true);
      expect(gh.issueComments[0]!.body).not.toBe(comment);
      expect(second.summary).toContain('Checklist comment updated');
      // The finding on LX-00002 is unchanged: its inline comment is not posted again.
      expect(gh.reviewComments).toHaveLength(inlineBefore);
      expect(second.stdout).toContain('1 already there');
    });
  },
);
