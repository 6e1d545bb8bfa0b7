/** One audited record -> its row of the registry index (keys and the claims the registry-wide checks compare). */
import type { ReadStructure } from '../checks/types.js';
import { recordKeys, type IndexRow } from '../registry/keys.js';
import type { LoadedRecord } from '../registry/types.js';
import { lineFor } from './findings.js';
import { sourcesOf } from './structures.js';

const nonEmpty = (s: unknown): s is string => typeof s === 'string' && s.trim() !== '';

export function indexRow(loaded: LoadedRecord, main: ReadStructure, seq: number): IndexRow {
  const record = loaded.record;
  let keys: IndexRow['keys'] = null;
  if (record !== null && main.facts) {
    const src = sourcesOf(loaded).main;
    keys = recordKeys(main.facts, src && src.text !== null ? { format: src.format, text: src.text } : null);
  }
  const waiver = record?.waivers?.find(
    (w) => w.check === 'consistent-with-registry' && nonEmpty(w.reason) && nonEmpty(w.approved_by),
  );
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
    waiver: waiver ? { reason: waiver.reason!.trim(), approvedBy: waiver.approved_by!.trim() } : null,
  };
}
