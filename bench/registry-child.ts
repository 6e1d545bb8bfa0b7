/**
 * One measured run of the registry benchmark (bench/registry.ts), in a process of its own so that its peak
 * resident memory (all threads) is its own: `tsx bench/registry-child.ts folder <root> <workers>` audits every
 * record file through the worker pool (src/bulk/folder-run.ts), `… bulk <csv> <workers>` the same records as a CSV
 * export with the registry-wide checks on. Prints one JSON line: records, wall and CPU seconds, peak RSS.
 */
import { realpathSync } from 'node:fs';
import { DEFAULT_CONFIG, loadConfig } from '../src/audit/config.js';
import { RECORD_BUDGET } from '../src/audit/run.js';
import { CHECKS } from '../src/checks/index.js';
import { runFolderAudit } from '../src/bulk/folder-run.js';
import { listRecordFiles, readRecordFolder } from '../src/bulk/record-files.js';
import { runBulkAudit } from '../src/bulk/run.js';

export interface RegistryChildResult {
  records: number;
  seconds: number;
  cpuSeconds: number;
  peakMiB: number;
}

async function main(): Promise<void> {
  const [mode, path, w] = process.argv.slice(2);
  const workers = Number(w);
  const t0 = performance.now();
  let records: number;
  if (mode === 'folder') {
    const root = realpathSync(path!);
    const { config } = loadConfig(root, undefined, undefined);
    const folder = readRecordFolder(root, listRecordFiles(root, config.recordDirs));
    const run = await runFolderAudit({
      folder,
      config,
      budget: RECORD_BUDGET,
      workers,
      json: false,
      progress: 'none',
      onRecord: () => undefined,
      checks: CHECKS,
    });
    records = run.summary.records;
  } else {
    const run = await runBulkAudit({
      inputs: [path!],
      mapping: { rotation: 'rotation' },
      config: { ...DEFAULT_CONFIG },
      workers,
      progress: 'none',
      writers: [],
    });
    records = run.trailer.summary.records;
  }
  const usage = process.resourceUsage();
  const result: RegistryChildResult = {
    records,
    seconds: (performance.now() - t0) / 1000,
    cpuSeconds: (usage.userCPUTime + usage.systemCPUTime) / 1e6,
    peakMiB: usage.maxRSS / 1024,
  };
  process.stdout.write(JSON.stringify(result) + '\n');
}

void main();
