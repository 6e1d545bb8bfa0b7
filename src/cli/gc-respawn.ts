/**
 * A bulk audit that puts a worker on every core runs faster with V8's parallel GC helpers off: they find no free
 * core, so each collection waits for them instead of going faster. Measured on the 2-vCPU development machine,
 * 100,000 records with 2 workers: 13.6-13.7 s with the helpers, 11.4-12.3 s without (`--single-threaded-gc`).
 *
 * V8 reads the flag when an isolate's heap is set up; setting it in a running process crashes the collector
 * (seen here: a fatal "concurrent_marking_handle_" check), so the command line starts itself again with the flag,
 * once, and passes its exit code on. Library callers (`runBulkAudit`) choose their own process flags.
 */
import { spawn } from 'node:child_process';
import { availableParallelism } from 'node:os';
import { isBulkInput } from '../bulk/run.js';

export const GC_FLAG = '--single-threaded-gc';
/** Set in the restarted process (and by anyone who wants no restart). */
export const NO_RESPAWN_ENV = 'STEREOGATE_NO_RESPAWN';

/** The rule: parallel GC helpers only wait when every core already runs a worker. */
export function wantsSingleThreadedGc(workers: number, cores: number): boolean {
  return workers >= 1 && workers >= cores;
}

/** Worker count an `audit` argument list asks for (default: all cores), or null when it is not a bulk audit. */
export function bulkWorkers(argv: readonly string[], cores: number): number | null {
  if (argv[0] !== 'audit' || argv.includes('--help') || argv.includes('-h')) return null;
  let workers = cores;
  let bulk = false;
  for (let i = 1; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--workers') workers = Number(argv[++i]);
    else if (a.startsWith('--workers=')) workers = Number(a.slice('--workers='.length));
    else if (!a.startsWith('-') && isBulkInput(a)) bulk = true;
  }
  return bulk && Number.isInteger(workers) ? workers : null;
}

/** Node arguments for the restart, or null when this process should just run. */
export function respawnArgs(
  argv: readonly string[],
  execArgv: readonly string[],
  script: string,
  env: NodeJS.ProcessEnv,
  cores: number,
): string[] | null {
  if (env[NO_RESPAWN_ENV] === '1' || execArgv.includes(GC_FLAG)) return null;
  const workers = bulkWorkers(argv, cores);
  if (workers === null || !wantsSingleThreadedGc(workers, cores)) return null;
  return [GC_FLAG, ...execArgv, script, ...argv];
}

/**
 * Runs the command line again with the GC flag when the rule says so; resolves to its exit code, or to null
 * when this process should run the command itself (no restart wanted, or the restart could not start).
 */
export function respawnForBulk(argv: readonly string[]): Promise<number | null> {
  const script = process.argv[1];
  if (!script) return Promise.resolve(null);
  const args = respawnArgs(argv, process.execArgv, script, process.env, availableParallelism());
  if (!args) return Promise.resolve(null);
  return new Promise((resolve) => {
    const child = spawn(process.execPath, args, {
      stdio: 'inherit',
      env: { ...process.env, [NO_RESPAWN_ENV]: '1' },
    });
    const forward = (signal: NodeJS.Signals) => () => child.kill(signal);
    const onInt = forward('SIGINT');
    const onTerm = forward('SIGTERM');
    process.on('SIGINT', onInt);
    process.on('SIGTERM', onTerm);
    child.on('error', () => resolve(null));
    child.on('exit', (code, signal) => {
      process.off('SIGINT', onInt);
      process.off('SIGTERM', onTerm);
      resolve(code ?? (signal ? 128 + (signal === 'SIGINT' ? 2 : 15) : 1));
    });
  });
}
