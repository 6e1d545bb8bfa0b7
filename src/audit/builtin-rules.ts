/** The kinds of finding the audit makes itself (not a check module), described like checks for reports. */
import type { Severity } from './types.js';
import { INTERNAL_ERROR_ID, SCHEMA_CHECK_ID, TIME_LIMIT_ID } from './findings.js';

export interface RuleInfo {
  id: string;
  defaultSeverity: Severity;
  summary: string;
  explanation: string;
}

export const BUILTIN_RULES: readonly RuleInfo[] = [
  {
    id: SCHEMA_CHECK_ID,
    defaultSeverity: 'error',
    summary: 'The record file is readable and follows the record format.',
    explanation:
      'Each record file must be UTF-8 YAML or JSON that follows schema/record.schema.json: the fields id, ' +
      'structure (exactly one of smiles or molfile) and stereo.form are required, no other fields are allowed, ' +
      'and the id must be unique in the registry. A record that fails the format is not checked further.',
  },
  {
    id: INTERNAL_ERROR_ID,
    defaultSeverity: 'error',
    summary: 'A check failed with an internal error.',
    explanation:
      'A check module threw while checking this record. The other checks and records were still audited. ' +
      'This is a fault in stereogate, not in the record; report it with the record attached.',
  },
  {
    id: TIME_LIMIT_ID,
    defaultSeverity: 'error',
    summary: 'The audit of a record stayed within its time limit and memory bound.',
    explanation:
      'Each record gets a time limit (20 s unless --record-timeout says otherwise) and a memory bound, so that one ' +
      'pathological structure cannot stall or exhaust a run. A record over either is reported instead of ' +
      'audited, and the run goes on. Audit it on its own with a higher limit, or simplify the structure.',
  },
];
