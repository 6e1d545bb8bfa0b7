/**
 * Where a streamed report goes, a piece at a time: a file (written as it comes, waiting when the disk is behind)
 * or the command's standard output (handed over in whole lines). And spill groups: a report that lists records
 * in groups (errors first, …) keeps each group's text in a temporary file until the end, not in memory.
 */
import {
  closeSync,
  createWriteStream,
  mkdtempSync,
  openSync,
  readSync,
  rmSync,
  writeSync,
  type WriteStream,
} from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { StringDecoder } from 'node:string_decoder';

export interface ReportSink {
  write(text: string): Promise<void>;
  close(): Promise<void>;
}

export function drainWrite(stream: WriteStream, text: string): Promise<void> {
  return stream.write(text) ? Promise.resolve() : new Promise((res) => stream.once('drain', () => res()));
}

export function close(stream: WriteStream): Promise<void> {
  return new Promise((res, rej) => stream.end((err?: Error | null) => (err ? rej(err) : res())));
}

/** A report file that could not be written (`cause`: the system's error). */
export class SinkFailed extends Error {
  constructor(override readonly cause: unknown) {
    super(`the report could not be written: ${(cause as Error)?.message ?? String(cause)}`);
  }
}

export function fileSink(path: string): ReportSink {
  const s = createWriteStream(path, 'utf8');
  let failed: SinkFailed | null = null;
  s.on('error', (e) => (failed = new SinkFailed(e)));
  const guard = (p: Promise<void>) => p.catch((e: unknown) => Promise.reject(failed ?? new SinkFailed(e)));
  return {
    write: (text) => (failed ? Promise.reject(failed) : guard(drainWrite(s, text))),
    close: () => (failed ? Promise.reject(failed) : guard(close(s))),
  };
}

/**
 * A sink over a line writer that ends every piece with a newline (the CLI's `io.out`): text is handed over up to
 * its last line break, in pieces of about 64 KiB; the report's last line ends with one.
 */
export function lineSink(out: (text: string) => void, piece = 1 << 16): ReportSink {
  let held = '';
  return {
    async write(text) {
      held += text;
      if (held.length < piece) return;
      const cut = held.lastIndexOf('\n');
      if (cut < 0) return;
      out(held.slice(0, cut + 1));
      held = held.slice(cut + 1);
    },
    async close() {
      if (held !== '') out(held);
      held = '';
    },
  };
}

/** Numbered groups of text, each kept in a temporary file and copied to a sink in order at the end. */
export class SpillGroups {
  private readonly dir = mkdtempSync(join(tmpdir(), 'stereogate-report-'));
  private readonly fds: number[];
  private readonly held: string[];
  /** Pieces added to each group. */
  readonly counts: number[];
  private removed = false;

  constructor(groups: number) {
    this.fds = Array.from({ length: groups }, (_, i) => openSync(join(this.dir, `${i}.txt`), 'w+'));
    this.held = Array.from({ length: groups }, () => '');
    this.counts = Array.from({ length: groups }, () => 0);
  }

  add(group: number, text: string): void {
    this.counts[group]!++;
    this.held[group] += text;
    if (this.held[group]!.length >= 1 << 16) this.flush(group);
  }

  private flush(group: number): void {
    if (this.held[group] === '') return;
    writeSync(this.fds[group]!, this.held[group]!);
    this.held[group] = '';
  }

  /** Copies one group's text to the sink, in the order it was added. */
  async copy(group: number, sink: ReportSink): Promise<void> {
    this.flush(group);
    const fd = this.fds[group]!;
    const buf = Buffer.allocUnsafe(1 << 20);
    const decoder = new StringDecoder('utf8');
    let at = 0;
    for (;;) {
      const n = readSync(fd, buf, 0, buf.length, at);
      if (n === 0) break;
      at += n;
      await sink.write(decoder.write(buf.subarray(0, n)));
    }
    const rest = decoder.end();
    if (rest !== '') await sink.write(rest);
  }

  /** Closes and deletes the files (once; later calls do nothing). */
  remove(): void {
    if (this.removed) return;
    this.removed = true;
    for (const fd of this.fds) closeSync(fd);
    rmSync(this.dir, { recursive: true, force: true });
  }
}
