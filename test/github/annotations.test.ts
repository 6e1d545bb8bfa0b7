import { describe, expect, it } from 'vitest';
import { buildAnnotations } from '../../src/github/annotations.js';
import { finding, record, result } from './support/results.js';

describe('buildAnnotations', () => {
  it('maps severities to annotation levels, on the repository path, errors first, waived left out', () => {
    const audit = result([
      record('compounds/a.yaml', [
        finding('note', 3),
        finding('warning', null),
        finding('error', 7),
        finding('error', 8, { waived: { reason: 'measured', approvedBy: 'Dr K' } }),
      ]),
    ]);
    const { annotations, omitted } = buildAnnotations(audit, 'registry');
    expect(annotations.map((a) => [a.level, a.file, a.line])).toEqual([
      ['error', 'registry/compounds/a.yaml', 7],
      ['warning', 'registry/compounds/a.yaml', null],
      ['notice', 'registry/compounds/a.yaml', 3],
    ]);
    expect(annotations[0]!.title).toBe('stereogate form-matches-structure (LX-00001)');
    expect(omitted).toBe(0);
  });

  it('caps the number and counts the rest', () => {
    const audit = result([
      record(
        'a.yaml',
        Array.from({ length: 5 }, (_, i) => finding('warning', i + 1)),
      ),
    ]);
    const { annotations, omitted } = buildAnnotations(audit, '', 3);
    expect(annotations).toHaveLength(3);
    expect(omitted).toBe(2);
  });
});
