/**
 * The audit with the real engine and the real check list, end to end through runAudit. Chemistry used:
 * meso-tartaric acid, (2R,3S)-2,3-dihydroxybutanedioic acid, is achiral (IUPAC Gold Book, "meso-compound",
 * whose example is meso-tartaric acid), so it cannot be a racemate; RDKit (@rdkit/rdkit) assigns the SMILES
 * OC(=O)[C@@H](O)[C@@H](O)C(=O)O the CIP labels S and R at atoms 4 and 6 (checked while writing this test).
 */
import { existsSync } from 'node:fs';
import { afterEach, describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import { renderJson } from '../../src/report/json.js';
import { tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const MESO = 'OC(=O)[C@@H](O)[C@@H](O)C(=O)O';

describe('runAudit with the real engine and checks', () => {
  it('flags meso-tartaric acid declared as a racemate at the line of stereo.form', async () => {
    reg = tmpRegistry({
      'compounds/LX-00002.yml': `id: LX-00002\nname: 2,3-dihydroxybutanedioic acid\nstructure:\n  smiles: "${MESO}"\nstereo:\n  form: racemate\n`,
      'compounds/LX-00003.yml': `id: LX-00003\nstructure:\n  smiles: "${MESO}"\nstereo:\n  form: meso\n`,
    });
    const result = await runAudit({ root: reg.root });
    const [racemate, meso] = result.records;
    const form = racemate!.findings.find((f) => f.check === 'form-matches-structure');
    expect(form).toBeDefined();
    expect(form!.severity).toBe('error');
    expect(form!.line).toBe(6);
    expect(racemate!.computed?.chiral).toBe(false);
    expect(racemate!.computed?.meso).toBe(true);
    expect(meso!.findings.filter((f) => f.check === 'form-matches-structure')).toEqual([]);
    expect(meso!.passed.map((p) => p.check)).toContain('form-matches-structure');
    for (const r of result.records)
      expect(r.findings.filter((f) => f.check === 'internal-error')).toEqual([]);
    const json = JSON.parse(renderJson(result));
    expect(json.records[0].computed.stereocenters.map((c: { label: string }) => c.label)).toEqual(['S', 'R']);
  });

  it('a molfile path escaping the registry is reported by the structure check, and the audit goes on', async () => {
    reg = tmpRegistry({
      'compounds/a.yml':
        'id: LX-00010\nstructure:\n  molfile: ../../../etc/hostname\nstereo:\n  form: achiral\n',
      'compounds/b.yml': 'id: LX-00011\nstructure:\n  smiles: CCO\nstereo:\n  form: achiral\n',
    });
    const result = await runAudit({ root: reg.root });
    const a = result.records[0]!;
    const refused = a.findings.find((f) => f.check === 'structure-readable');
    expect(refused?.line).toBe(3);
    expect(refused?.message).toContain('leaves the registry folder');
    expect(result.records[1]!.findings.filter((f) => f.severity === 'error')).toEqual([]);
  });
});

describe.skipIf(!existsSync('fixtures/demo-registry/compounds'))('the demo registry', () => {
  it('audits every record without an internal error', async () => {
    const result = await runAudit({ root: 'fixtures/demo-registry' });
    expect(result.records.length).toBeGreaterThanOrEqual(25);
    const internal = result.records.flatMap((r) =>
      r.findings.filter((f) => f.check === 'internal-error').map((f) => `${r.file}: ${f.message}`),
    );
    expect(internal).toEqual([]);
    expect(result.summary.errors).toBeGreaterThan(0); // it has wrong records on purpose
  });
});
