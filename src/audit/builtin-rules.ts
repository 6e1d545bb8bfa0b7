/** The two kinds of finding the audit makes itself (not a check module), described like checks for reports. */
import type { Severity } from './types.js';
import { INTERNAL_ERROR_ID, SCHEMA_CHECK_ID } from './findings.js';

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
];
