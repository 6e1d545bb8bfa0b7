/** Record files are named relative to the registry root; GitHub names files relative to the repository root. */
import { posix } from 'node:path';

/** `registryDir` is the registry root relative to the repository root ('' or '.' for the root itself). */
export function toRepoPath(registryDir: string, file: string): string {
  const joined = posix.normalize(
    posix.join(registryDir === '' ? '.' : registryDir, file.replace(/\\/g, '/')),
  );
  return joined.replace(/^\.\//, '');
}

/** The inverse: a repository path inside the registry root, relative to it; null when outside. */
export function toRegistryPath(registryDir: string, repoPath: string): string | null {
  const dir = posix.normalize(registryDir === '' ? '.' : registryDir).replace(/\/+$/, '');
  if (dir === '.') return repoPath;
  return repoPath.startsWith(dir + '/') ? repoPath.slice(dir.length + 1) : null;
}
