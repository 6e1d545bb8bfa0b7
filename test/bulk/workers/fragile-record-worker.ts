// Test worker of the folder audit: audits record files as the real worker does, but a file named crash.yml
// ends the worker (a stand-in for a record that kills it) and one named stall.yml never finishes.
import {
  auditRecordFile,
  makeFolderContext,
  type FolderContext,
  type FolderSetup,
} from '../../../src/bulk/record-file-audit.js';
import type { RecordFileItem } from '../../../src/bulk/record-files.js';
import { serveWorker } from '../../../src/bulk/worker-entry.js';

let ctx: Promise<FolderContext> | null = null;

serveWorker<RecordFileItem, unknown>(async (item, data) => {
  if (item.file.endsWith('crash.yml')) process.exit(3);
  if (item.file.endsWith('stall.yml'))
    for (;;) {
      /* stall */
    }
  ctx ??= makeFolderContext(data as FolderSetup);
  return auditRecordFile(item, await ctx);
});
