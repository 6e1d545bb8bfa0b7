/** action.yml and the settings reader must agree: every input documented with a default, every input read. */
import { mkdtempSync, realpathSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'yaml';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readSettings } from '../../src/action/settings.js';

interface ActionYml {
  name: string;
  description: string;
  branding: { icon: string; color: string };
  inputs: Record<string, { description?: string; default?: string }>;
  outputs: Record<string, { description?: string }>;
  runs: { using: string; main: string };
}

const action = parse(readFileSync('action.yml', 'utf8')) as ActionYml;

describe('action.yml', () => {
  // GitHub docs, "Metadata syntax for GitHub Actions": runs.using node24, main is the entry file.
  it('runs dist/index.js on node24 and has a name, description and branding', () => {
    expect(action.runs).toEqual({ using: 'node24', main: 'dist/index.js' });
    expect(action.name.length).toBeGreaterThan(0);
    expect(action.description.length).toBeGreaterThan(0);
    expect(action.branding.icon.length).toBeGreaterThan(0);
  });

  it('gives every input a description and a default; the token defaults to the workflow token', () => {
    for (const [name, input] of Object.entries(action.inputs)) {
      expect(input.description, name).toBeTruthy();
      expect(typeof input.default, name).toBe('string');
    }
    expect(action.inputs.token?.default).toBe('${{ github.token }}');
  });

  it('names exactly the inputs the settings reader reads, and the outputs the action sets', () => {
    const asked = new Set<string>();
    const ws = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-yml-')));
    try {
      readSettings((name) => (asked.add(name), ''), { GITHUB_WORKSPACE: ws });
    } finally {
      rmSync(ws, { recursive: true, force: true });
    }
    expect([...asked].sort()).toEqual(Object.keys(action.inputs).sort());
    expect(Object.keys(action.outputs).sort()).toEqual([
      'errors',
      'notes',
      'report-file',
      'sarif-file',
      'warnings',
    ]);
  });

  it('has defaults the settings reader accepts', () => {
    const ws = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-yml-')));
    try {
      const s = readSettings((name) => action.inputs[name]?.default ?? '', { GITHUB_WORKSPACE: ws });
      expect(s.failOn).toBe('error');
      expect(s.records).toEqual({ kind: 'changed' });
    } finally {
      rmSync(ws, { recursive: true, force: true });
    }
  });
});
