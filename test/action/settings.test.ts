import { mkdirSync, mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parseBoolean, parseRecordChoice, readSettings, SettingsError } from '../../src/action/settings.js';

const workspace = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-ws-')));
mkdirSync(join(workspace, 'registry'));
const eventPath = join(workspace, 'event.json');
writeFileSync(
  eventPath,
  JSON.stringify({
    pull_request: {
      number: 12,
      changed_files: 3,
      base: { sha: 'a'.repeat(40) },
      head: { sha: 'b'.repeat(40) },
    },
  }),
);
afterAll(() => rmSync(workspace, { recursive: true, force: true }));

const env = {
  GITHUB_WORKSPACE: workspace,
  GITHUB_REPOSITORY: 'larkspur/registry',
  GITHUB_EVENT_NAME: 'pull_request',
  GITHUB_EVENT_PATH: eventPath,
  GITHUB_API_URL: 'http://127.0.0.1:9',
  GITHUB_SERVER_URL: 'https://github.com',
  GITHUB_RUN_ID: '42',
};
const inputs = (given: Record<string, string>) => (name: string) => given[name] ?? '';

describe('readSettings', () => {
  it('reads every input and the pull request from the event payload', () => {
    const s = readSettings(
      inputs({
        token: 'tok',
        'registry-path': 'registry',
        'fail-on': 'warning',
        'checklist-comment': 'false',
        'max-inline-comments': '3',
        'sarif-file': 'out/s.sarif',
        'report-file': '',
      }),
      env,
    );
    expect(s.token).toBe('tok');
    expect(s.repoRoot).toBe(workspace);
    expect(s.registryRoot).toBe(join(workspace, 'registry'));
    expect(s.registryDir).toBe('registry');
    expect(s.failOn).toBe('warning');
    expect(s.checklistComment).toBe(false);
    expect(s.inlineComments).toBe(true);
    expect(s.maxInlineComments).toBe(3);
    expect(s.sarifFile).toBe(join(workspace, 'out/s.sarif'));
    expect(s.reportFile).toBeNull();
    expect(s.configFile).toBeNull();
    expect(s.runUrl).toBe('https://github.com/larkspur/registry/actions/runs/42');
    expect(s.pullRequest).toEqual({
      owner: 'larkspur',
      repo: 'registry',
      number: 12,
      baseSha: 'a'.repeat(40),
      headSha: 'b'.repeat(40),
      changedFiles: 3,
    });
  });

  it('takes GitHub paths relative to the checkout holding the registry (two checkouts side by side)', () => {
    mkdirSync(join(workspace, 'pr', '.git'), { recursive: true });
    mkdirSync(join(workspace, 'pr', 'registry'), { recursive: true });
    const s = readSettings(
      inputs({ 'registry-path': 'pr/registry', 'config-file': 'base/stereogate.config.yml' }),
      env,
    );
    expect(s.repoRoot).toBe(join(workspace, 'pr'));
    expect(s.registryDir).toBe('registry');
    expect(s.configFile).toBe(join(workspace, 'base/stereogate.config.yml'));
  });

  it('has no pull request on a push event', () => {
    const pushEvent = join(workspace, 'push.json');
    writeFileSync(pushEvent, JSON.stringify({ ref: 'refs/heads/main' }));
    expect(
      readSettings(inputs({}), { ...env, GITHUB_EVENT_NAME: 'push', GITHUB_EVENT_PATH: pushEvent })
        .pullRequest,
    ).toBeNull();
  });

  it('refuses bad values with a message naming the input', () => {
    expect(() => readSettings(inputs({ 'fail-on': 'errors' }), env)).toThrow(
      /fail-on must be error, warning or never/,
    );
    expect(() => readSettings(inputs({ 'max-inline-comments': '-1' }), env)).toThrow(SettingsError);
    expect(() => readSettings(inputs({ 'registry-path': '../elsewhere' }), env)).toThrow(
      /inside the workspace/,
    );
  });
});

describe('input parsers', () => {
  // YAML 1.2 core schema booleans, the set @actions/core's getBooleanInput accepts.
  it('accepts the YAML 1.2 core booleans only', () => {
    expect(parseBoolean('True', 'x', false)).toBe(true);
    expect(parseBoolean('FALSE', 'x', true)).toBe(false);
    expect(parseBoolean('', 'x', true)).toBe(true);
    expect(() => parseBoolean('yes', 'x', true)).toThrow(/x must be true or false/);
  });

  it('reads the records choice', () => {
    expect(parseRecordChoice('')).toEqual({ kind: 'changed' });
    expect(parseRecordChoice('all')).toEqual({ kind: 'all' });
    expect(parseRecordChoice('compounds/LX-1.yaml\n\n  compounds/old/ \n')).toEqual({
      kind: 'listed',
      paths: ['compounds/LX-1.yaml', 'compounds/old/'],
    });
  });
});

describe('index-cache', () => {
  it("defaults to a file in the runner's temporary folder, none outside Actions; 'none' turns it off", () => {
    const tmp = join(workspace, 'runner-temp');
    expect(readSettings(inputs({}), { ...env, RUNNER_TEMP: tmp }).indexCache).toBe(
      join(tmp, 'stereogate', 'index-cache.json'),
    );
    expect(readSettings(inputs({}), env).indexCache).toBeNull();
    expect(
      readSettings(inputs({ 'index-cache': 'none' }), { ...env, RUNNER_TEMP: tmp }).indexCache,
    ).toBeNull();
    expect(readSettings(inputs({ 'index-cache': '.cache/sg.json' }), env).indexCache).toBe(
      join(workspace, '.cache/sg.json'),
    );
  });
});

describe('API limits', () => {
  it('reads api-timeout (seconds, decimals allowed), api-tries and api-max-wait, with defaults 30 s, 3, 90 s', () => {
    expect(readSettings(inputs({}), env).api).toEqual({ timeoutMs: 30_000, tries: 3, maxWaitMs: 90_000 });
    const s = readSettings(inputs({ 'api-timeout': '0.5', 'api-tries': '1', 'api-max-wait': '600' }), env);
    expect(s.api).toEqual({ timeoutMs: 500, tries: 1, maxWaitMs: 600_000 });
  });
  it('refuses a timeout that is not a positive number', () => {
    expect(() => readSettings(inputs({ 'api-timeout': '0' }), env)).toThrow(SettingsError);
    expect(() => readSettings(inputs({ 'api-timeout': 'soon' }), env)).toThrow(/api-timeout/);
  });
});
