/**
 * `npm run bench`: speed and memory, always as a ratio against a baseline measured in the same run (never as a
 * timed test). Sections (run one with `npm run bench -- engine`):
 *   engine  describe-equivalent work over the ~12,800 MoleculeNet structures vs OpenChemLib's default path
 *   cip     share of the per-record audit time spent in CIP labelling
 *   bulk    bulk audit of 100,000 records (MoleculeNet replicated, invented claims) with 1 and 2 workers
 *   action  a 20-record pull request against a 5,000-record registry vs the pure audit of the same records
 *   pr      a one-record pull request against BENCH_REGISTRY_RECORDS (default 20,000) through the key index,
 *           cold (no cache) and warm (cache), beside the review that loads every record
 *   registry  bulk with and without the registry-wide checks, and the folder audit, of the same records
 *   outputs Markdown escaping vs the former escaping; the 10,000-record HTML report opened in chromium; the
 *           HTML report's computed layouts vs reading and describing the same structures
 *   origin  the pull-request audit with an origin on every record vs without; the mapping's bound per record
 * Data: Wu et al., "MoleculeNet", Chem. Sci. 2018, 9, 513 (../shared/data/moleculenet).
 */
import { existsSync } from 'node:fs';
import { loadMoleculeNet } from '../test/support/moleculenet.js';
import { SHARED_DATA_DIR } from '../test/support/shared-data.js';

const wanted = new Set(process.argv.slice(2));
const want = (s: string) => wanted.size === 0 || wanted.has(s);

async function main(): Promise<void> {
  if (!existsSync(SHARED_DATA_DIR)) {
    console.log(`bench: ${SHARED_DATA_DIR} not found; the benchmarks need the shared MoleculeNet data.`);
    process.exitCode = 1;
    return;
  }
  const rows = loadMoleculeNet();
  const smiles = rows.map((r) => r.smiles);
  console.log(
    `stereogate benchmarks — ${smiles.length} MoleculeNet structures, node ${process.version}, ${new Date().toISOString()}`,
  );
  const ctx: BenchContext = { smiles, perRecordAuditSeconds: null };
  for (const [name, section] of SECTIONS) {
    if (!want(name)) continue;
    console.log(`\n== ${name} ==`);
    try {
      await section(ctx);
    } catch (e) {
      console.log(`section ${name} failed: ${(e as Error).stack ?? e}`);
      process.exitCode = 1;
    }
  }
}

export interface BenchContext {
  smiles: string[];
  /** Filled by the bulk section (seconds per record, one worker), used by the cip section. */
  perRecordAuditSeconds: number | null;
}

type Section = (ctx: BenchContext) => Promise<void>;

const SECTIONS: [string, Section][] = [
  ['engine', async (ctx) => (await import('./engine.js')).benchEngine(ctx)],
  ['bulk', async (ctx) => (await import('./bulk.js')).benchBulk(ctx)],
  ['cip', async (ctx) => (await import('./cip.js')).benchCip(ctx)],
  ['action', async (ctx) => (await import('./action.js')).benchAction(ctx)],
  ['pr', async (ctx) => (await import('./pr-index.js')).benchPrIndex(ctx)],
  [
    'registry',
    async (ctx) =>
      process.argv.includes('registry')
        ? (await import('./registry.js')).benchRegistry(ctx)
        : console.log('only when asked: npm run bench -- registry (BENCH_REGISTRY_RECORDS, default 20,000)'),
  ],
  [
    'outputs',
    async (ctx) => {
      const outputs = await import('./outputs.js');
      await outputs.benchOutputs();
      outputs.benchDepictions(ctx);
    },
  ],
  ['origin', async (ctx) => (await import('./origin.js')).benchOrigin(ctx)],
  [
    'bulk-memory',
    async (ctx) =>
      process.argv.includes('bulk-memory')
        ? (await import('./bulk.js')).benchBulkMemory(ctx)
        : console.log('only when asked: npm run bench -- bulk-memory'),
  ],
];

void main();
