import { existsSync, mkdtempSync, readFileSync, realpathSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import nock from 'nock';
import { afterAll, describe, expect, it } from 'vitest';
import { judge, review } from '../../src/action/review.js';
import type { ActionSettings } from '../../src/action/settings.js';
import { finding, record, result } from '../github/support/results.js';
import { API, testClient, useNock } from '../github/support/nock.js';
import { actionSettings } from './support/settings.js';
import { fakeEngine, recordingRunner } from './support/fakes.js';

useNock();

const workspace = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-review-')));
afterAll(() => rmSync(workspace, { recursive: true, force: true }));

function settings(over: Partial<ActionSettings> = {}): ActionSettings {
  return actionSettings(workspace, { apiUrl: API, ...over });
}

const repo = '/repos/larkspur/registry';
const audit = result([
  record('compounds/LX-00001.yaml', [finding('error', 6), finding('warning', 40)]),
  record(
    'compounds/LX-00002.yaml',
    [finding('note', 3, { waived: { reason: 'measured', approvedBy: 'Dr K' } })],
    'LX-00002',
  ),
]);
const files = [
  {
    filename: 'compounds/LX-00001.yaml',
    status: 'modified',
    patch: '@@ -5,2 +5,2 @@\n stereo:\n-  form: achiral\n+  form: racemate',
  },
  { filename: 'compounds/LX-00002.yaml', status: 'added', patch: '@@ -0,0 +1,3 @@\n+id: LX-00002\n+a\n+b' },
  { filename: 'README.md', status: 'modified' },
];

describe('review', () => {
  it('audits the changed records, writes every output, posts the checklist and the inline comment, fails on errors', async () => {
    nock(API)
      .get(`${repo}/pulls/7/files`)
      .query(true)
      .reply(200, files)
      .get(`${repo}/issues/7/comments`)
      .query(true)
      .reply(200, [])
      .post(
        `${repo}/issues/7/comments`,
        (b: { body: string }) =>
          b.body.includes('<!-- stereogate-checklist -->') && b.body.includes('max 60000'),
      )
      .reply(201, { id: 5, html_url: 'https://github.test/c/5' })
      .get(`${repo}/issues/7/comments`)
      .query(true)
      .reply(200, [
        {
          id: 5,
          body: '<!-- stereogate-checklist -->\n2 records, 1 errors (max 60000, details https://github.test/larkspur/registry/actions/runs/1)',
          html_url: 'https://github.test/c/5',
          user: { login: 'github-actions[bot]', type: 'Bot' },
        },
      ])
      .get(`${repo}/pulls/7/comments`)
      .query(true)
      .reply(200, [])
      .post(
        `${repo}/pulls/7/comments`,
        (b: { path: string; line: number; body: string }) =>
          b.path === 'compounds/LX-00001.yaml' && b.line === 6 && b.body.includes('https://github.test/c/5'),
      )
      .reply(201, { id: 6 })
      .get(`${repo}/pulls/7/comments`)
      .query(true)
      .reply(200, []);
    const engine = fakeEngine(audit);
    const runner = recordingRunner();
    const { client } = testClient();
    const outcome = await review(settings(), engine, client, runner);

    expect(engine.calls[0]!.paths).toEqual(['compounds/LX-00001.yaml', 'compounds/LX-00002.yaml']);
    expect(outcome.failure).toBe('stereogate found 1 error (fail-on: error).');
    expect(runner.outputs).toEqual({
      errors: 1,
      warnings: 1,
      notes: 0,
      'sarif-file': join(workspace, 'out', 'stereogate.sarif'),
      'report-file': join(workspace, 'out', 'report.md'),
    });
    expect(JSON.parse(readFileSync(join(workspace, 'out', 'stereogate.sarif'), 'utf8'))).toEqual({
      version: '2.1.0',
      uriPrefix: '',
      results: 1,
    });
    expect(readFileSync(join(workspace, 'out', 'report.md'), 'utf8')).toContain('max Infinity'); // the report file holds the full checklist
    expect(runner.annotations.map((a) => [a.level, a.line])).toEqual([
      ['error', 6],
      ['warning', 40],
    ]);
    // The checklist is in the summary before anything is posted; what posting did is added after.
    expect(runner.summaries).toHaveLength(2);
    expect(runner.summaries[0]).toContain('<!-- stereogate-checklist -->');
    expect(runner.summaries[1]).toContain('Checklist comment created');
    expect(runner.summaries[1]).toContain('1 inline comment posted');
    expect(runner.summaries[1]).toContain('1 finding on lines outside the diff');
    expect(runner.warnings).toEqual([]);
  });

  it('on a fork (403 for the comment) does not fail because of it, says so, and still writes summary and SARIF', async () => {
    nock(API)
      .get(`${repo}/pulls/7/files`)
      .query(true)
      .reply(200, files)
      .get(`${repo}/issues/7/comments`)
      .query(true)
      .reply(200, [])
      .post(`${repo}/issues/7/comments`)
      .reply(403, { message: 'Resource not accessible by integration' });
    const runner = recordingRunner();
    const sarifFile = join(workspace, 'fork.sarif');
    const outcome = await review(
      settings({ failOn: 'never', sarifFile }),
      fakeEngine(audit),
      testClient().client,
      runner,
    );
    expect(outcome.failure).toBeNull();
    expect(runner.warnings.join('\n')).toMatch(/read-only token/);
    expect(runner.summaries.join('')).toMatch(/read-only token/);
    expect(existsSync(sarifFile)).toBe(true);
    expect(runner.annotations).toHaveLength(2);
  });

  it('with the API failing throughout, audits every record and still writes summary, annotations and SARIF', async () => {
    nock(API)
      .get(`${repo}/pulls/7/files`)
      .query(true)
      .times(3)
      .reply(502)
      .get(`${repo}/issues/7/comments`)
      .query(true)
      .times(3)
      .reply(503);
    const engine = fakeEngine(audit);
    const runner = recordingRunner();
    const sarifFile = join(workspace, 'down.sarif');
    // The workspace is not a git checkout either, so git cannot list the files.
    const outcome = await review(settings({ sarifFile }), engine, testClient().client, runner);
    expect(engine.calls[0]!.paths).toBeUndefined();
    expect(runner.warnings[0]).toMatch(/auditing every record instead/);
    expect(runner.warnings.join('\n')).toMatch(/Could not post the checklist comment .*HTTP 503/);
    expect(existsSync(sarifFile)).toBe(true);
    expect(runner.annotations).toHaveLength(2);
    expect(runner.summaries).toHaveLength(2);
    expect(outcome.failure).not.toBeNull();
  });

  it('with no record changed audits none and only updates an earlier checklist comment', async () => {
    nock(API)
      .get(`${repo}/pulls/7/files`)
      .query(true)
      .reply(200, [{ filename: 'README.md', status: 'modified' }])
      .get(`${repo}/issues/7/comments`)
      .query(true)
      .reply(200, []);
    const engine = fakeEngine(audit);
    const runner = recordingRunner();
    const outcome = await review(settings(), engine, testClient().client, runner);
    expect(engine.calls[0]!.paths).toEqual([]);
    expect(outcome.failure).toBeNull();
    expect(runner.summaries.join('')).toMatch(/no earlier checklist comment: none posted/);
  });

  it('posts nothing and asks no API outside a pull request', async () => {
    const engine = fakeEngine(audit);
    const runner = recordingRunner();
    await review(
      settings({ pullRequest: null, eventName: 'push', sarifFile: null, reportFile: null }),
      engine,
      testClient().client,
      runner,
    );
    expect(engine.calls[0]!.paths).toBeUndefined();
    expect(runner.summaries.join('')).toMatch(/Not a pull request/);
    expect(runner.outputs['sarif-file']).toBe('');
  });
});

describe('judge', () => {
  // Waived findings are not in the summary counts, so they cannot fail the step.
  it('fails by the threshold', () => {
    const warningsOnly = result([
      record('a.yaml', [
        finding('warning', 1),
        finding('error', 2, { waived: { reason: 'r', approvedBy: 'a' } }),
      ]),
    ]);
    expect(judge(warningsOnly, 'error')).toBeNull();
    expect(judge(warningsOnly, 'warning')).toMatch(/1 warning/);
    expect(judge(audit, 'never')).toBeNull();
  });
});
