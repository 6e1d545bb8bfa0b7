/** The stable JSON report of the issue: fixed keys in a fixed order, severities from the fixed set. */
import { describe, expect, it } from 'vitest';
import { renderJson } from '../../src/report/json.js';
import { sampleResult } from './sample-result.js';

describe('renderJson', () => {
  const out = renderJson(sampleResult());
  const parsed = JSON.parse(out);

  it('has the stable keys, in order, with extras after them', () => {
    expect(Object.keys(parsed).slice(0, 2)).toEqual(['records', 'summary']);
    expect(Object.keys(parsed.summary).slice(0, 4)).toEqual(['records', 'errors', 'warnings', 'notes']);
    expect(Object.keys(parsed.records[0]).slice(0, 4)).toEqual(['id', 'file', 'computed', 'findings']);
    expect(Object.keys(parsed.records[0].findings[0]).slice(0, 4)).toEqual([
      'check',
      'severity',
      'message',
      'line',
    ]);
  });

  it('carries the values unchanged (no escaping in JSON) and null lines as null', () => {
    const f = parsed.records[0].findings;
    expect(f[0].message).toContain('<img src=x');
    expect(f[1].line).toBeNull();
    expect(f.map((x: { severity: string }) => x.severity)).toEqual(['error', 'note', 'warning']);
    expect(f[2].waived).toEqual({
      reason: 'literature value @chem-leads <b>x</b>',
      approvedBy: 'Dr. R. Vale',
    });
    expect(parsed.records[0].computed.constitutionKey).toBe('C[CH](O)N');
    expect(parsed.records[1].computed).toBeNull();
    expect(parsed.summary).toEqual({ records: 2, errors: 1, warnings: 0, notes: 1, waived: 1 });
  });

  it('is byte-identical for the same result', () => {
    expect(renderJson(sampleResult())).toBe(out);
    expect(out.endsWith('\n')).toBe(true);
  });
});
