/** One audited record -> its row of the registry index (keys and the claims the registry-wide checks compare). */
import { consistentWithRegistry } from '../checks/consistent-with-registry.js';
import type { ReadStructure } from '../checks/types.js';
import { waiversOf } from '../checks/waivers.js';
import { recordKeys, type IndexRow } from '../registry/keys.js';
import type { LoadedRecord } from '../registry/types.js';
import { lineFor } from './findings.js';
import { sourcesOf } from './structures.js';

export function indexRow(loaded: LoadedRecord, main: ReadStructure, seq: number): IndexRow {
  const record = loaded.record;
  let keys: IndexRow['keys'] = null;
  if (record !== null && main.facts) {
    const src = sourcesOf(loaded).main;
    keys = recordKeys(main.facts, src && src.text !== null ? { format: src.format, text: src.text } : null);
  }
  return {
    seq,
    id: loaded.id,
    file: loaded.file,
    name: record?.name ?? null,
    form: record?.stereo.form ?? 'unknown',
    rotation: record?.stereo.rotation ?? null,
    keys,
    lines: {
      id: lineFor(loaded, 'id'),
      structure: lineFor(loaded, 'structure'),
      rotation: lineFor(loaded, 'stereo.rotation.value'),
    },
    waivers: waiversOf(record, consistentWithRegistry.id),
  };
}
