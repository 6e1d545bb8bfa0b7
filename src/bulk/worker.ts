/**
 * Worker thread of the bulk audit: loads the engine and the checks once, then audits items as they come and
 * hands back each record already rendered for the outputs (a few strings: cheap to pass to the main thread).
 */
import { auditItem } from './audit-item.js';
import { makeItemContext, type BulkContext, type WorkerSetup } from './context.js';
import type { RenderedRecord } from './render-record.js';
import type { BulkItem } from './sources.js';
import { serveWorker } from './worker-entry.js';

let ready: Promise<BulkContext> | null = null;

serveWorker<BulkItem & { seq: number }, RenderedRecord>(async (item, data) => {
  ready ??= makeItemContext(data as WorkerSetup);
  const ctx = await ready;
  return ctx.render(auditItem(item, ctx));
});
