/**
 * Progress for long bulk runs: a bar with rate and time left on a terminal (cli-progress), plain periodic lines
 * in CI logs (no control characters), nothing when asked for quiet.
 */
import cliProgress from 'cli-progress';

export type ProgressMode = 'auto' | 'bar' | 'lines' | 'none';

export interface Progress {
  tick(n?: number): void;
  stop(): void;
}

export function makeProgress(
  mode: ProgressMode,
  total: number | null,
  stream: NodeJS.WriteStream = process.stderr,
  every = { ms: 10_000 },
): Progress {
  const resolved = mode === 'auto' ? (stream.isTTY && !process.env.CI ? 'bar' : 'lines') : mode;
  if (resolved === 'none') return { tick() {}, stop() {} };
  const started = Date.now();
  let done = 0;
  if (resolved === 'bar') {
    const bar = new cliProgress.SingleBar(
      {
        stream,
        format:
          ' auditing |{bar}| {percentage}% | {value}/{total} records | {rate} rec/s | {eta_formatted} left',
        barCompleteChar: '\u2588',
        barIncompleteChar: '\u2591',
        hideCursor: true,
        etaBuffer: 200,
      },
      cliProgress.Presets.shades_classic,
    );
    bar.start(total ?? 0, 0, { rate: '0' });
    return {
      tick(n = 1) {
        done += n;
        const rate = done / Math.max(0.001, (Date.now() - started) / 1000);
        if (total === null) bar.setTotal(done);
        bar.update(done, { rate: rate.toFixed(0) });
      },
      stop() {
        bar.stop();
      },
    };
  }
  let last = started;
  const line = (final: boolean) => {
    const secs = (Date.now() - started) / 1000;
    const rate = done / Math.max(0.001, secs);
    const pct = total ? ` (${Math.floor((100 * done) / total)}%)` : '';
    const left = total && rate > 0 && !final ? `, about ${Math.ceil((total - done) / rate)} s left` : '';
    stream.write(
      `stereogate: ${done.toLocaleString('en-US')}${total ? ' / ' + total.toLocaleString('en-US') : ''} records${pct}, ` +
        `${ratePerSecond(rate)} records/s${left}${final ? `, done in ${secs.toFixed(1)} s` : ''}\n`,
    );
  };
  return {
    tick(n = 1) {
      done += n;
      const now = Date.now();
      if (now - last >= every.ms) {
        last = now;
        line(false);
      }
    },
    stop() {
      line(true);
    },
  };
}

/** A rate in words: whole numbers from 10 up, one decimal below (a slow or short run is not "0 records/s"). */
export function ratePerSecond(rate: number): string {
  return rate >= 10 || rate === 0 ? rate.toFixed(0) : rate.toFixed(1);
}
