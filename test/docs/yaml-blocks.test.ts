/**
 * Every YAML block in the README and docs/*.md parses (YAML 1.2, the `yaml` package, no errors or warnings), and
 * every workflow among them is complete enough to copy: `on:` triggers, `permissions`, and a `concurrency` group —
 * per pull request for workflows that review pull requests — and a Node version still maintained in any
 * setup-node step. GitHub docs, "Workflow syntax for GitHub Actions" (on, permissions, concurrency, jobs); Node's
 * release schedule: 20 reaches end of life in April 2026 (from memory), so setup steps ask for 22 or later.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseDocument } from 'yaml';
import { describe, expect, it } from 'vitest';

interface Block {
  file: string;
  line: number;
  lang: string;
  text: string;
}

/** Fenced code blocks (CommonMark: a run of 3+ backticks or tildes opens; the same character, as long or longer, closes). */
export function fencedBlocks(file: string, markdown: string): Block[] {
  const blocks: Block[] = [];
  const lines = markdown.split(/\r?\n/);
  for (let i = 0; i < lines.length; i++) {
    const open = /^ {0,3}(`{3,}|~{3,})\s*([\w-]*)/.exec(lines[i]!);
    if (open === null) continue;
    const fence = open[1]!;
    const body: string[] = [];
    let j = i + 1;
    for (; j < lines.length; j++) {
      const close = /^ {0,3}(`{3,}|~{3,})\s*$/.exec(lines[j]!);
      if (close !== null && close[1]![0] === fence[0] && close[1]!.length >= fence.length) break;
      body.push(lines[j]!);
    }
    blocks.push({ file, line: i + 1, lang: open[2]!.toLowerCase(), text: body.join('\n') });
    i = j;
  }
  return blocks;
}

const files = ['README.md', ...readdirSync('docs').filter((f) => f.endsWith('.md')).map((f) => join('docs', f))];
const yamlBlocks = files
  .flatMap((f) => fencedBlocks(f, readFileSync(f, 'utf8')))
  .filter((b) => b.lang === 'yaml' || b.lang === 'yml');

describe('YAML in the README and docs', () => {
  it('finds the blocks (the workflows of docs/action.md among them)', () => {
    expect(yamlBlocks.length).toBeGreaterThanOrEqual(5);
    expect(yamlBlocks.filter((b) => b.file === join('docs', 'action.md')).length).toBeGreaterThanOrEqual(3);
  });

  it.each(yamlBlocks.map((b) => [`${b.file}:${b.line}`, b] as const))('%s parses', (_where, block) => {
    const doc = parseDocument(block.text, { prettyErrors: true, uniqueKeys: true });
    expect(doc.errors.map((e) => e.message)).toEqual([]);
    expect(doc.warnings.map((e) => e.message)).toEqual([]);
  });

  const workflows = yamlBlocks
    .map((b) => ({ block: b, value: parseDocument(b.text).toJS() as Record<string, unknown> | null }))
    .filter((w) => w.value !== null && typeof w.value === 'object' && 'jobs' in w.value);

  it('has workflows to check', () => {
    expect(workflows.length).toBeGreaterThanOrEqual(4);
  });

  it.each(workflows.map((w) => [`${w.block.file}:${w.block.line}`, w.value!] as const))(
    '%s is a complete workflow: on, permissions, concurrency, a maintained Node',
    (_where, wf) => {
      expect(wf.on, 'on:').toBeTruthy();
      expect(wf.permissions, 'permissions:').toBeTruthy();
      const concurrency = wf.concurrency as { group?: string } | undefined;
      expect(concurrency?.group, 'concurrency group').toBeTruthy();
      const triggers = Object.keys(wf.on as Record<string, unknown>);
      if (triggers.some((t) => t.startsWith('pull_request'))) {
        expect(concurrency!.group).toContain('github.event.pull_request.number');
      }
      const jobs = wf.jobs as Record<string, { steps?: { uses?: string; with?: Record<string, unknown> }[] }>;
      for (const job of Object.values(jobs)) {
        for (const step of job.steps ?? []) {
          if (!step.uses?.startsWith('actions/setup-node')) continue;
          const version = Number(String(step.with?.['node-version'] ?? '').split('.')[0]);
          expect(version, 'node-version').toBeGreaterThanOrEqual(22);
        }
      }
    },
  );
});
