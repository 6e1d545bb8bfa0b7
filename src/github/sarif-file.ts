/**
 * Writes the SARIF log for upload to code scanning. Code scanning wants artifact URIs relative to the repository
 * root; the audit names files relative to the registry root, so relative URIs get the registry directory in front.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { dirname } from 'node:path';
import { toRepoPath } from './paths.js';

export async function writeSarifFile(path: string, sarif: object, registryDir: string): Promise<void> {
  const rebased = registryDir === '' || registryDir === '.' ? sarif : rebaseUris(sarif, registryDir);
  await mkdir(dirname(path), { recursive: true });
  await writeFile(path, JSON.stringify(rebased, null, 2) + '\n', 'utf8');
}

/** A copy with every relative `artifactLocation.uri` prefixed by the registry directory. */
export function rebaseUris(value: unknown, registryDir: string): unknown {
  if (Array.isArray(value)) return value.map((v) => rebaseUris(v, registryDir));
  if (value === null || typeof value !== 'object') return value;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value)) {
    if (k === 'artifactLocation' && v !== null && typeof v === 'object' && 'uri' in v) {
      const loc = v as { uri: unknown; uriBaseId?: unknown };
      const uri = loc.uri;
      const relative = typeof uri === 'string' && !/^[a-z][a-z0-9+.-]*:/i.test(uri) && !uri.startsWith('/');
      out[k] = relative ? { ...loc, uri: toRepoPath(registryDir, uri) } : v;
    } else {
      out[k] = rebaseUris(v, registryDir);
    }
  }
  return out;
}
