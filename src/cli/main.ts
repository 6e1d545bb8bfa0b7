/**
 * stereogate command line: `stereogate <command> [arguments]`. The commands are data (commands/index.ts).
 * Exit codes: 0 done, 1 findings at the --fail-on level (audit), 2 usage error or an input or output that cannot
 * be used (a structure that cannot be read, a report path that cannot be written), 3 stereogate itself failed
 * (EXIT_CRASH: never shared with "findings found").
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { commands } from './commands/index.js';
import { EXIT_CRASH, EXIT_OK, EXIT_USAGE, InputError, UsageError, type Io } from './command.js';
import { VERSION } from '../audit/version.js';
import { respawnForBulk } from './gc-respawn.js';

export { respawnForBulk };

export const nodeIo: Io = {
  out: (t) => process.stdout.write(t.endsWith('\n') ? t : `${t}\n`),
  err: (t) => process.stderr.write(t.endsWith('\n') ? t : `${t}\n`),
  readFile: (p) => readFileSync(p, 'utf8'),
  isFile: (p) => p.length < 4096 && existsSync(p) && statSync(p).isFile(),
  readStdin: () => readFileSync(0, 'utf8'),
};

function overview(): string {
  const width = Math.max(...commands.map((c) => c.name.length));
  return [
    'Usage: stereogate <command> [arguments]',
    '',
    'Commands:',
    ...commands.map((c) => `  ${c.name.padEnd(width)}  ${c.summary}`),
    '',
    'Run `stereogate <command> --help` for the arguments of one command; `stereogate --version` for the version.',
  ].join('\n');
}

export async function run(argv: string[], io: Io = nodeIo): Promise<number> {
  const [name, ...rest] = argv;
  if (name === '--version' || name === '-V') {
    io.out(`stereogate ${VERSION}`);
    return EXIT_OK;
  }
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    (name === undefined ? io.err : io.out)(overview());
    return name === undefined ? EXIT_USAGE : EXIT_OK;
  }
  const command = commands.find((c) => c.name === name);
  if (!command) {
    io.err(`stereogate: unknown command "${name}"\n\n${overview()}`);
    return EXIT_USAGE;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.out(command.usage);
    return EXIT_OK;
  }
  try {
    return await command.run(rest, io);
  } catch (e) {
    if (e instanceof UsageError) {
      io.err(`stereogate ${command.name}: ${e.message}\n\n${e.usage ?? command.usage}`);
      return EXIT_USAGE;
    }
    if (e instanceof InputError) {
      io.err(`stereogate ${command.name}: ${e.message}`);
      return EXIT_USAGE;
    }
    io.err(crashMessage(`stereogate ${command.name}`, e));
    return EXIT_CRASH;
  }
}

/** What a crash prints: the error with its stack, and that it is a fault of stereogate, not of the input. */
export function crashMessage(where: string, e: unknown): string {
  const detail = e instanceof Error ? (e.stack ?? `${e.name}: ${e.message}`) : String(e);
  return (
    `${where}: internal error, stopped (exit code ${EXIT_CRASH}). This is a fault in stereogate, not a finding ` +
    `about the records; outputs hold what was computed before it. Please report it with the input.\n${detail}`
  );
}

/**
 * Errors raised outside any command's call chain (a stream callback, a timer) also end the run with EXIT_CRASH
 * instead of Node's default 1, which would read as "findings found".
 */
export function installCrashHandlers(): void {
  const onCrash = (e: unknown): void => {
    // the reader of our output went away (`stereogate describe … | head`): not a crash, nothing left to say
    if ((e as NodeJS.ErrnoException | null)?.code === 'EPIPE') process.exit(Number(process.exitCode ?? 0));
    process.stderr.write(`${crashMessage('stereogate', e)}\n`);
    process.exit(EXIT_CRASH);
  };
  process.on('uncaughtException', onCrash);
  process.on('unhandledRejection', onCrash);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  installCrashHandlers();
  const argv = process.argv.slice(2);
  // a bulk audit with a worker on every core restarts once with V8's parallel GC helpers off (gc-respawn.ts)
  process.exitCode = (await respawnForBulk(argv)) ?? (await run(argv));
}
