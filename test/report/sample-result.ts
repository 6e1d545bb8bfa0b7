/** A hand-built audit result with hostile record text, for the report tests. */
import type { AuditResult, Finding } from '../../src/audit/types.js';
import { CAUTION } from '../../src/audit/caution.js';
import { fakeFacts } from '../audit/fake-engine.js';

export function finding(over: Partial<Finding>): Finding {
  return {
    check: 'form-check',
    messageId: 'm',
    severity: 'error',
    message: 'Declared meso, but the structure is chiral.',
    data: {},
    line: 5,
    field: 'stereo.form',
    waived: null,
    ...over,
  };
}

export const HOSTILE =
  'ping @team <img src=x onerror=alert(1)> [x](javascript:alert(1)) ![i](http://evil/i.png) **bold** `code`';

export function sampleResult(): AuditResult {
  return {
    tool: { name: 'stereogate', version: '0.1.0' },
    records: [
      {
        id: 'LX-00001',
        file: 'compounds/LX-00001.yml',
        computed: fakeFacts('C[C@H](O)N'),
        findings: [
          finding({ message: `Declared ${HOSTILE}` }),
          finding({
            check: 'ratio-check',
            severity: 'note',
            line: null,
            field: null,
            message: 'A 1:1 mixture; was it measured?',
          }),
          finding({
            check: 'rotation-check',
            severity: 'warning',
            line: 9,
            message: 'Rotation sign disagrees.',
            waived: { reason: 'literature value @chem-leads <b>x</b>', approvedBy: 'Dr. R. Vale' },
          }),
        ],
        passed: [{ check: 'structure-check', evidence: 'structure read (5 atoms)' }],
        declared: { form: 'meso', descriptors: '(2R,3S)' },
      },
      {
        id: '@owner <script>',
        file: 'compounds/odd name [1].yml',
        computed: null,
        findings: [],
        passed: [{ check: 'structure-check', evidence: 'ok' }],
        declared: { form: 'achiral', descriptors: null },
      },
    ],
    summary: { records: 2, errors: 1, warnings: 0, notes: 1, waived: 1 },
    caution: CAUTION,
  };
}
