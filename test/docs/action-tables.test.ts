/**
 * docs/action.md and action.yml agree: the Inputs table names every input of action.yml, no other, each with the
 * default action.yml gives (empty written as "(empty)"), and the Outputs table names every output. GitHub docs,
 * "Metadata syntax for GitHub Actions" (inputs, default, outputs).
 */
import { readFileSync } from 'node:fs';
import { parse } from 'yaml';
import { describe, expect, it } from 'vitest';

const action = parse(readFileSync('action.yml', 'utf8')) as {
  inputs: Record<string, { default?: string }>;
  outputs: Record<string, unknown>;
};
const doc = readFileSync('docs/action.md', 'utf8');

/** The rows of the Markdown table under `## heading`: first cell without its backticks -> second cell. */
function table(heading: string): Map<string, string> {
  const start = doc.indexOf(`\n## ${heading}\n`);
  expect(start, `docs/action.md has a section "${heading}"`).toBeGreaterThan(-1);
  const rest = doc.slice(start + heading.length + 5);
  const section = rest.slice(0, rest.search(/\n## /) === -1 ? undefined : rest.search(/\n## /));
  const rows = new Map<string, string>();
  for (const line of section.split('\n')) {
    const m = /^\| `([^`]+)`\s*\|\s*(.*?)\s*\|/.exec(line);
    if (m) rows.set(m[1]!, m[2]!);
  }
  return rows;
}

const cellOf = (value: string): string => (value === '' ? '(empty)' : `\`${value}\``);

describe('docs/action.md and action.yml', () => {
  it('the Inputs table: every input, no other, with its default', () => {
    const rows = table('Inputs');
    expect([...rows.keys()].sort()).toEqual(Object.keys(action.inputs).sort());
    for (const [name, input] of Object.entries(action.inputs))
      expect(rows.get(name), name).toBe(cellOf(input.default ?? ''));
  });

  it('the Outputs table: every output, no other', () => {
    expect([...table('Outputs').keys()].sort()).toEqual(Object.keys(action.outputs).sort());
  });
});
