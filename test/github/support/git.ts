/** Temporary git repositories for the tests: write files, commit, get the commit id. */
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';

export interface TempRepo {
  dir: string;
  write(files: Record<string, string>): void;
  remove(path: string): void;
  commit(message: string): string;
  git(...args: string[]): string;
  dispose(): void;
}

export function tempRepo(): TempRepo {
  const dir = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-repo-')));
  const git = (...args: string[]): string =>
    execFileSync('git', args, {
      cwd: dir,
      encoding: 'utf8',
      env: {
        ...process.env,
        GIT_AUTHOR_NAME: 'Larkspur Registrar',
        GIT_AUTHOR_EMAIL: 'registrar@larkspur.example',
        GIT_COMMITTER_NAME: 'Larkspur Registrar',
        GIT_COMMITTER_EMAIL: 'registrar@larkspur.example',
        GIT_CONFIG_NOSYSTEM: '1',
      },
    });
  git('init', '-q', '-b', 'main');
  return {
    dir,
    write(files) {
      for (const [path, text] of Object.entries(files)) {
        mkdirSync(dirname(join(dir, path)), { recursive: true });
        writeFileSync(join(dir, path), text);
      }
    },
    remove(path) {
      rmSync(join(dir, path));
    },
    commit(message) {
      git('add', '-A');
      git('commit', '-q', '--allow-empty', '-m', message);
      return git('rev-parse', 'HEAD').trim();
    },
    git,
    dispose() {
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
