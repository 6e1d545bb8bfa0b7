/**
 * The action's own path (GitHub Action issue): a 20-record pull request against a 5,000-record registry, run as
 * the runner runs dist/index.js (a loopback server stands in for the REST API), beside the pure audit of the same
 * 20 records against the same registry in the same run, and the registry load alone. Each line gives wall time and
 * CPU seconds (user + system; the child's measured inside it), since other work on the machine stretches wall time.
 * Aim: the pull-request path within 15 s on 2 cores.
 * Records: MoleculeNet structures (Wu et al., Chem. Sci. 2018, 9, 513) with invented claims (form: unknown).
 */
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { parse } from 'yaml';
import { runAudit } from '../src/audit/run.js';
import { loadRegistry } from '../src/registry/load.js';
import { startFakeGitHub } from '../test/action/support/fake-github.js';
import { tempRepo } from '../test/github/support/git.js';
import type { BenchContext } from './run.js';
import { fmt, timeAsync } from './util.js';

const REGISTRY = 5000;
const CHANGED = 20;
const TARGET_SECONDS = 15;

/** CPU seconds (user + system) used by this process while `fn` runs. */
async function cpuOf<T>(fn: () => Promise<T>): Promise<{ cpu: number; value: T }> {
  const c0 = process.cpuUsage();
  const value = await fn();
  const c = process.cpuUsage(c0);
  return { cpu: (c.user + c.system) / 1e6, value };
}

/** Preloaded into the child: writes its own CPU seconds to `file` when it exits. */
const cpuReporter = (file: string): string =>
  'data:text/javascript,' +
  encodeURIComponent(
    `import { writeFileSync } from 'node:fs'; process.on('exit', () => { const c = process.cpuUsage(); ` +
      `writeFileSync(${JSON.stringify(file)}, String((c.user + c.system) / 1e6)); });`,
  );

const recordText = (n: number, smiles: string): string =>
  `id: LX-${String(n).padStart(5, '0')}\nname: "Larkspur compound ${n}"\nstructure:\n  smiles: ${JSON.stringify(smiles)}\nstereo:\n  form: unknown\n`;

export async function benchAction(ctx: BenchContext): Promise<void> {
  const bundle = resolve('dist/index.js');
  if (!existsSync(bundle)) {
    console.log('action: dist/index.js not built (npm run bundle); section skipped.');
    return;
  }
  const unique = [...new Set(ctx.smiles)].slice(0, REGISTRY);
  const repo = tempRepo();
  const dir = mkdtempSync(join(tmpdir(), 'stereogate-bench-action-'));
  const gh = await startFakeGitHub('larkspur', 'registry', 1);
  try {
    const file = (n: number): string => `compounds/LX-${String(n).padStart(5, '0')}.yaml`;
    const files: Record<string, string> = {};
    for (let n = 1; n <= unique.length - CHANGED; n++) files[file(n)] = recordText(n, unique[n - 1]!);
    repo.write(files);
    const base = repo.commit('registry');
    const changed: Record<string, string> = {};
    for (let n = unique.length - CHANGED + 1; n <= unique.length; n++)
      changed[file(n)] = recordText(n, unique[n - 1]!);
    repo.write(changed);
    const head = repo.commit('twenty new records');
    gh.files = Object.keys(changed).map((filename) => ({
      filename,
      status: 'added',
      patch: repo.git('diff', `${base}...${head}`, '--', filename).split('\n').slice(4).join('\n'),
    }));

    const pure = await cpuOf(() =>
      timeAsync(`pure audit: ${CHANGED} records against ${unique.length}`, CHANGED, () =>
        runAudit({ root: repo.dir, paths: Object.keys(changed) }),
      ),
    );
    const load = await cpuOf(() =>
      timeAsync(`loadRegistry alone (after the audit)`, unique.length, async () =>
        loadRegistry(repo.dir, { recordDirs: ['compounds'] }),
      ),
    );

    const event = join(dir, 'event.json');
    writeFileSync(
      event,
      JSON.stringify({
        pull_request: { number: 1, changed_files: CHANGED, base: { sha: base }, head: { sha: head } },
      }),
    );
    const env: Record<string, string> = {
      PATH: process.env.PATH ?? '',
      HOME: dir,
      GITHUB_EVENT_NAME: 'pull_request',
      GITHUB_EVENT_PATH: event,
      GITHUB_REPOSITORY: 'larkspur/registry',
      GITHUB_WORKSPACE: repo.dir,
      GITHUB_API_URL: gh.url,
      GITHUB_OUTPUT: join(dir, 'output'),
      GITHUB_STEP_SUMMARY: join(dir, 'summary'),
    };
    const action = parse(readFileSync('action.yml', 'utf8')) as {
      inputs: Record<string, { default?: string }>;
    };
    for (const [name, input] of Object.entries(action.inputs)) {
      env[`INPUT_${name.replace(/ /g, '_').toUpperCase()}`] =
        name === 'token' ? 'bench-token' : (input.default ?? '');
    }
    env['INPUT_SARIF-FILE'] = join(dir, 'out.sarif');
    env['INPUT_REPORT-FILE'] = join(dir, 'report.md');
    writeFileSync(env.GITHUB_OUTPUT!, '');
    writeFileSync(env.GITHUB_STEP_SUMMARY!, '');
    const run = promisify(execFile);
    const cpuFile = join(dir, 'child-cpu');
    const actionPath = await timeAsync(`action: dist/index.js on the pull request`, CHANGED, async () => {
      const args = ['--import', cpuReporter(cpuFile), bundle];
      await run(process.execPath, args, { cwd: repo.dir, env, maxBuffer: 64 * 1024 * 1024 }).catch(
        (e: { code?: unknown }) => {
          if (typeof e.code !== 'number') throw e; // a non-zero exit (findings over the threshold) is fine here
        },
      );
    });
    const childCpu = existsSync(cpuFile) ? Number(readFileSync(cpuFile, 'utf8')) : NaN;
    const cpu = (c: number): string => `  cpu ${c.toFixed(2).padStart(6)} s`;
    console.log(fmt(pure.value.timing) + cpu(pure.cpu));
    console.log(fmt(load.value.timing) + cpu(load.cpu));
    console.log(fmt(actionPath.timing) + cpu(childCpu));
    const s = actionPath.timing.seconds;
    const p = pure.value.timing.seconds;
    console.log(
      `action path ${s.toFixed(2)} s vs pure audit ${p.toFixed(2)} s (${(s / p).toFixed(2)}x); ` +
        `cpu ${childCpu.toFixed(2)} s vs ${pure.cpu.toFixed(2)} s (${(childCpu / pure.cpu).toFixed(2)}x); ` +
        `target <= ${TARGET_SECONDS} s: ${s <= TARGET_SECONDS ? 'met' : 'NOT met'}`,
    );
    console.log(
      `comments posted: ${gh.issueComments.length} checklist, ${gh.reviewComments.length} inline; unexpected requests: ${gh.unexpected.length}`,
    );
  } finally {
    await gh.close();
    repo.dispose();
    rmSync(dir, { recursive: true, force: true });
  }
}
