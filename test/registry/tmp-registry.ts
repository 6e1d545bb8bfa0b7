/** Builds throw-away registries in the OS temp folder for loader and audit tests. */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';

export interface TmpRegistry {
  root: string;
  write(path: string, content: string | Buffer): string;
  remove(): void;
}

export function tmpRegistry(files: Record<string, string | Buffer> = {}): TmpRegistry {
  const root = mkdtempSync(join(tmpdir(), 'stereogate-reg-'));
  const write = (path: string, content: string | Buffer): string => {
    const abs = join(root, path);
    mkdirSync(dirname(abs), { recursive: true });
    writeFileSync(abs, content);
    return abs;
  };
  for (const [p, c] of Object.entries(files)) write(p, c);
  return { root, write, remove: () => rmSync(root, { recursive: true, force: true }) };
}

/** The text of a minimal YAML record: id, a SMILES and a form, then `extra` lines under stereo (indented by 2). */
export const recordYaml = (id: string, form: string, extra = '', smiles = 'CC'): string =>
  `id: ${id}\nstructure:\n  smiles: "${smiles}"\nstereo:\n  form: ${form}\n${extra}`;
