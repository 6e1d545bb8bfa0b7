/** What every CLI command provides. The command table (commands/index.ts) is a plain list of these. */
export interface Io {
  out: (text: string) => void;
  err: (text: string) => void;
  /** Reads a file as UTF-8; throws like fs.readFileSync when it cannot. */
  readFile: (path: string) => string;
  /** true when `path` names an existing file. */
  isFile: (path: string) => boolean;
  readStdin: () => string;
}

export interface Command {
  name: string;
  /** One line for `stereogate --help`. */
  summary: string;
  /** Full usage text for `stereogate <name> --help`. */
  usage: string;
  run: (args: string[], io: Io) => number | Promise<number>;
}

/**
 * A usage error: main prints the message and the usage (`usage` when given, else the command's) and exits with
 * code 2.
 */
export class UsageError extends Error {
  constructor(
    message: string,
    readonly usage?: string,
  ) {
    super(message);
  }
}

/** An input or output the command cannot use (unreadable structure, unwritable --output): one line, exit 2. */
export class InputError extends Error {}

export const EXIT_OK = 0;
/** Findings at the --fail-on level (audit). Usage errors and unusable inputs or outputs exit EXIT_USAGE. */
export const EXIT_FINDINGS = 1;
export const EXIT_USAGE = 2;
/**
 * stereogate itself failed (a bug, or a fault outside the input: disk full, out of memory). Never 1, so a crash
 * is never read as "findings found"; whatever was computed before the crash is still written.
 */
export const EXIT_CRASH = 3;
