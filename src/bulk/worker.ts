/**
 * Worker thread of the bulk audit: loads the engine and the checks once, then audits items as they come and
 * hands back each record already rendered for the outputs (a few strings: cheap to pass to the main thread).
 * The same worker serves the streamed folder audit (a setup of kind 'record-files': items are record files).
 */
import { auditItem } from './audit-item.js';
import { makeItemContext, type BulkContext, type WorkerSetup } from './context.js';
import {
  auditRecordFile,
  makeFolderContext,
  type FolderContext,
  type FolderRecord,
  type FolderSetup,
} from './record-file-audit.js';
import type { RecordFileItem } from './record-files.js';
import type { RenderedRecord } from './render-record.js';
import type { BulkItem } from './sources.js';
import { serveWorker } from './worker-entry.js';

let ready: Promise<BulkContext> | null = null;
let folder: Promise<FolderContext> | null = null;

type Item = (BulkItem & { seq: number }) | RecordFileItem;

serveWorker<Item, RenderedRecord | FolderRecord>(async (item, data) => {
  if ((data as FolderSetup).kind === 'record-files') {
    folder ??= makeFolderContext(data as FolderSetup);
    return auditRecordFile(item as RecordFileItem, await folder);
  }
  ready ??= makeItemContext(data as WorkerSetup);
  const ctx = await ready;
  return ctx.render(auditItem(item as BulkItem & { seq: number }, ctx));
});
