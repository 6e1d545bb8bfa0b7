/**
 * SARIF output against the required properties of the SARIF 2.1.0 OASIS standard (sarif-v2.1.0-os, with
 * errata 01). Section numbers are from the standard as we remember it (from memory): §3.13 sarifLog (version
 * "2.1.0", runs), §3.14 run (tool), §3.18 tool (driver), §3.19 toolComponent (name), §3.27 result (message;
 * level one of none/note/warning/error), §3.11 message (text or id), §3.28 location, §3.29 physicalLocation
 * (artifactLocation, region), §3.30 region (startLine >= 1), §3.49 reportingDescriptor (id), §3.12
 * multiformatMessageString (text), §3.50 reportingConfiguration (level), §3.35 suppression (kind: inSource or
 * external).
 */
import { describe, expect, it } from 'vitest';
import { renderSarif } from '../../src/report/sarif.js';
import type { CheckModule } from '../../src/checks/types.js';
import { sampleResult } from './sample-result.js';

type Json = Record<string, unknown>;
const LEVELS = ['none', 'note', 'warning', 'error'];

function isObj(v: unknown): v is Json {
  return v !== null && typeof v === 'object' && !Array.isArray(v);
}

/** Returns the violations of the required properties listed in the file comment. */
function sarifViolations(log: unknown): string[] {
  const bad: string[] = [];
  const need = (cond: boolean, what: string) => {
    if (!cond) bad.push(what);
  };
  need(isObj(log), 'sarifLog is an object');
  if (!isObj(log)) return bad;
  need(log.version === '2.1.0', 'sarifLog.version is "2.1.0"');
  need(Array.isArray(log.runs), 'sarifLog.runs is an array');
  for (const [i, run] of ((log.runs as unknown[]) ?? []).entries()) {
    need(isObj(run) && isObj(run.tool), `runs[${i}].tool`);
    if (!isObj(run) || !isObj(run.tool)) continue;
    const driver = run.tool.driver;
    need(
      isObj(driver) && typeof driver.name === 'string' && driver.name !== '',
      `runs[${i}].tool.driver.name`,
    );
    const rules = (isObj(driver) && Array.isArray(driver.rules) ? driver.rules : []) as unknown[];
    rules.forEach((r, k) => {
      need(isObj(r) && typeof r.id === 'string', `rules[${k}].id`);
      for (const key of ['shortDescription', 'fullDescription', 'help']) {
        const m = isObj(r) ? r[key] : undefined;
        if (m !== undefined) need(isObj(m) && typeof m.text === 'string', `rules[${k}].${key}.text`);
      }
      const dc = isObj(r) ? r.defaultConfiguration : undefined;
      if (dc !== undefined)
        need(isObj(dc) && LEVELS.includes(String(dc.level)), `rules[${k}].defaultConfiguration.level`);
    });
    const results = (Array.isArray(run.results) ? run.results : []) as unknown[];
    results.forEach((res, k) => {
      need(
        isObj(res) &&
          isObj(res.message) &&
          (typeof res.message.text === 'string' || typeof res.message.id === 'string'),
        `results[${k}].message`,
      );
      if (!isObj(res)) return;
      if (res.level !== undefined) need(LEVELS.includes(String(res.level)), `results[${k}].level`);
      if (res.ruleIndex !== undefined) {
        need(
          Number.isInteger(res.ruleIndex) &&
            (res.ruleIndex as number) >= 0 &&
            (res.ruleIndex as number) < rules.length,
          `results[${k}].ruleIndex in range`,
        );
        const rule = rules[res.ruleIndex as number];
        need(isObj(rule) && rule.id === res.ruleId, `results[${k}].ruleIndex points at ruleId`);
      }
      for (const loc of (Array.isArray(res.locations) ? res.locations : []) as unknown[]) {
        const pl = isObj(loc) ? loc.physicalLocation : undefined;
        if (!isObj(pl)) continue;
        need(
          pl.artifactLocation === undefined || isObj(pl.artifactLocation),
          `results[${k}] artifactLocation`,
        );
        const region = pl.region;
        if (region !== undefined)
          need(
            isObj(region) && Number.isInteger(region.startLine) && (region.startLine as number) >= 1,
            `results[${k}] region.startLine`,
          );
      }
      for (const s of (Array.isArray(res.suppressions) ? res.suppressions : []) as unknown[]) {
        need(isObj(s) && (s.kind === 'inSource' || s.kind === 'external'), `results[${k}] suppression.kind`);
      }
    });
  }
  return bad;
}

const checks: CheckModule[] = [
  {
    id: 'form-check',
    defaultSeverity: 'error',
    summary: 'The declared form agrees with the structure.',
    explanation: 'Chemistry here (IUPAC 2013, P-93).',
    messages: { m: 'x' },
    run: () => ({ findings: [] }),
  },
  {
    id: 'structure-check',
    defaultSeverity: 'warning',
    summary: 'The structure can be read.',
    explanation: 'OpenSMILES.',
    messages: {},
    run: () => ({ findings: [] }),
  },
];

describe('renderSarif', () => {
  const log = JSON.parse(renderSarif(sampleResult(), checks)) as Json;
  const run = (log.runs as Json[])[0]!;
  const driver = (run.tool as Json).driver as Json;
  const results = run.results as Json[];

  it('meets the required properties of SARIF 2.1.0', () => {
    expect(sarifViolations(log)).toEqual([]);
    // the validator itself catches faults
    expect(
      sarifViolations({ version: '2.0.0', runs: [{ tool: { driver: {} }, results: [{ level: 'fatal' }] }] })
        .length,
    ).toBe(4);
  });

  it('has rules from the check metadata, plus the audit’s own rules and any check seen only in findings', () => {
    const rules = driver.rules as Json[];
    const ids = rules.map((r) => r.id);
    expect(ids.slice(0, 2)).toEqual(['form-check', 'structure-check']);
    expect(ids).toContain('record-schema');
    expect(ids).toContain('internal-error');
    expect(ids).toContain('ratio-check');
    const form = rules[0]!;
    expect(form.shortDescription).toEqual({ text: 'The declared form agrees with the structure.' });
    expect(form.fullDescription).toEqual({ text: 'Chemistry here (IUPAC 2013, P-93).' });
    expect((form.help as Json).text).toContain('P-93');
    // a code-scanning alert shows its rule's help, never the run's properties: the caution is there
    for (const r of rules) expect((r.help as Json).text).toMatch(/\n\nCaution: .*responsible chemist/);
    expect(form.defaultConfiguration).toEqual({ level: 'error' });
    expect((rules[1]!.defaultConfiguration as Json).level).toBe('warning');
  });

  it('has one result per finding with ruleId, level, message and a location relative to the root', () => {
    expect(results).toHaveLength(3);
    const first = results[0]!;
    expect(first.ruleId).toBe('form-check');
    expect(first.level).toBe('error');
    expect((first.message as Json).text).toContain('Declared ping @team');
    const loc = (first.locations as Json[])[0]!.physicalLocation as Json;
    expect(loc.artifactLocation).toEqual({ uri: 'compounds/LX-00001.yml' });
    expect(loc.region).toEqual({ startLine: 5 });
    // a finding without a line has no region
    expect(((results[1]!.locations as Json[])[0]!.physicalLocation as Json).region).toBeUndefined();
    expect(results[1]!.level).toBe('note');
  });

  it('marks a waived finding as suppressed in source with the justification', () => {
    const waived = results[2]!;
    expect(waived.suppressions).toEqual([
      {
        kind: 'inSource',
        status: 'accepted',
        justification: 'literature value @chem-leads <b>x</b> (approved by Dr. R. Vale)',
      },
    ]);
  });

  it('percent-encodes file names and honours a repository prefix', () => {
    const r = sampleResult();
    r.records[1]!.findings.push(r.records[0]!.findings[0]!);
    const l2 = JSON.parse(renderSarif(r, checks, { uriPrefix: 'registry' })) as Json;
    const res = ((l2.runs as Json[])[0]!.results as Json[]).at(-1)!;
    const uri = (((res.locations as Json[])[0]!.physicalLocation as Json).artifactLocation as Json).uri;
    expect(uri).toBe('registry/compounds/odd%20name%20%5B1%5D.yml');
  });
});
