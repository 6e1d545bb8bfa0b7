/**
 * Merge the JSON Lines outputs of `--shard i/N` runs into the result of a single run: records in input order
 * (by `seq`, a k-way merge of the already ordered shard files, streamed), totals recomputed the same way.
 */
import { createReadStream } from 'node:fs';
import { createInterface } from 'node:readline';
import type { BulkRecordResult } from './audit-item.js';
import { BulkAccumulator } from './accumulate.js';
import { DEFAULT_CONFIG } from '../audit/config.js';
import type { AuditConfig } from '../checks/types.js';
import { BulkRegistryPhase } from './registry-stream.js';
import { makeRenderer, type RenderedRecord } from './render-record.js';
import { bulkSarifRules } from './sarif-writer.js';
import { wantsOf, type BulkTrailer, type RecordWriter } from './writers.js';

export class MergeError extends Error {}

async function* readShard(path: string): AsyncGenerator<BulkRecordResult | BulkTrailer> {
  const rl = createInterface({ input: createReadStream(path, 'utf8'), crlfDelay: Infinity });
  let n = 0;
  for await (const line of rl) {
    n++;
    if (line.trim() === '') continue;
    let v: { kind?: string };
    try {
      v = JSON.parse(line);
    } catch {
      throw new MergeError(`${path}:${n}: not a JSON line of a stereogate bulk output`);
    }
    if (v.kind === 'record') {
      const { kind: _k, ...rest } = v as BulkRecordResult & { kind: string };
      yield rest as BulkRecordResult;
    } else if (v.kind === 'summary') yield v as BulkTrailer;
    else throw new MergeError(`${path}:${n}: unknown line kind '${String(v.kind)}'`);
  }
}

export async function mergeShards(
  paths: string[],
  writers: RecordWriter[],
  onRecord?: (r: RenderedRecord) => void,
  /** The configuration of the shard runs (severities of the registry-wide findings); default the defaults. */
  config: AuditConfig = DEFAULT_CONFIG,
): Promise<BulkTrailer> {
  const { CHECKS } = await import('../checks/index.js');
  const render = makeRenderer(wantsOf(writers), bulkSarifRules(CHECKS));
  // the registry-wide phase over the records of every shard, in input order: what one run would have found
  const phase = await BulkRegistryPhase.create(config, render, CHECKS);
  const streams = paths.map((p) => readShard(p));
  const heads: (BulkRecordResult | null)[] = [];
  const shards: (string | null)[] = paths.map(() => null);
  const advance = async (i: number): Promise<BulkRecordResult | null> => {
    for (;;) {
      const next = await streams[i].next();
      if (next.done) return null;
      if ('kind' in next.value && next.value.kind === 'summary') {
        shards[i] = next.value.shard;
        continue;
      }
      return next.value as BulkRecordResult;
    }
  };
  for (let i = 0; i < streams.length; i++) heads.push(await advance(i));
  const acc = new BulkAccumulator();
  let lastSeq = 0;
  for (;;) {
    let best = -1;
    for (let i = 0; i < heads.length; i++)
      if (heads[i] && (best < 0 || heads[i]!.seq < heads[best]!.seq)) best = i;
    if (best < 0) break;
    const r = heads[best]!;
    if (r.seq === lastSeq)
      throw new MergeError(`record ${r.seq} appears in more than one shard output (${paths[best]})`);
    lastSeq = r.seq;
    const rendered = phase.result(r);
    acc.add(rendered.tally);
    for (const w of writers) await w.write(rendered);
    onRecord?.(rendered);
    heads[best] = await advance(best);
  }
  const missing = shards.map((s, i) => (s === null ? paths[i] : null)).filter(Boolean);
  if (missing.length > 0)
    throw new MergeError(`no summary line in ${missing.join(', ')} (an unfinished shard run?)`);
  const counts = new Set(shards.map((s) => s!.split('/')[1]));
  if (counts.size > 1)
    throw new MergeError(`the shard outputs come from different splits: ${shards.join(', ')}`);
  const n = Number([...counts][0]);
  const have = new Set(shards.map((s) => Number(s!.split('/')[0])));
  const absent = Array.from({ length: n }, (_, i) => i + 1).filter((i) => !have.has(i));
  if (absent.length > 0)
    throw new MergeError(
      `shard${absent.length > 1 ? 's' : ''} ${absent.map((i) => `${i}/${n}`).join(', ')} missing from the merge`,
    );
  const trailer = acc.trailer(null);
  trailer.registry = phase.summary();
  for (const w of writers) await w.finish(trailer);
  return trailer;
}
