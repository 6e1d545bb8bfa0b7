/** Worker thread of the bulk audit: loads the engine and the checks once, then audits items as they come. */
import { auditItem, type ItemContext } from './audit-item.js';
import { makeItemContext, type WorkerSetup } from './context.js';
import type { BulkItem } from './sources.js';
import { serveWorker } from './worker-entry.js';

let ready: Promise<ItemContext> | null = null;

serveWorker<BulkItem & { seq: number }, unknown>(async (item, data) => {
  ready ??= makeItemContext(data as WorkerSetup);
  return auditItem(item, await ready);
});
