/**
 * A record whose structure has a stereogenic axis the input format cannot state (BINOL as SMILES) is open, not
 * wrong: the form and descriptor checks say "not verified" as notes and never pass or fail the claim. BINOL,
 * 1,1'-bi-2-naphthol, exists as (R)/(S) atropisomers (from memory); the axis is found by a rule of thumb on ortho
 * substitution (common practice, no source), whose threshold is the config key axisOrthoMin.
 */
import { afterEach, describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import { tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';

let reg: TmpRegistry | null = null;
const form = (r: { findings: { check: string; message: string }[] }) =>
  r.findings.find((f) => f.check === 'form-matches-structure')!;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const BINOL = 'OC1=CC=C2C=CC=CC2=C1C1=C2C=CC=CC2=CC=C1O';
const record = (id: string, name: string, form: string): string =>
  `id: ${id}\nname: "${name}"\nstructure:\n  smiles: "${BINOL}"\nstereo:\n  form: ${form}\n`;

describe('BINOL from SMILES in an audit', () => {
  it('declared single enantiomer or racemate: unverified notes, no error, not passed', async () => {
    reg = tmpRegistry({
      'compounds/LX-00101.yml': record('LX-00101', "(R)-1,1'-bi-2-naphthol", 'single-enantiomer'),
      'compounds/LX-00102.yml': record('LX-00102', "1,1'-bi-2-naphthol", 'racemate'),
    });
    const result = await runAudit({ root: reg.root });
    expect(result.records).toHaveLength(2);
    for (const r of result.records) {
      expect(r.findings.filter((f) => f.severity !== 'note')).toEqual([]);
      const form = r.findings.find((f) => f.check === 'form-matches-structure');
      expect(form?.messageId).toBe('form-open-unstated-units');
      expect(form?.message).toContain('not verified');
      expect(r.passed.map((p) => p.check)).not.toContain('form-matches-structure');
      expect(r.computed?.chiral).toBeNull();
      expect(r.computed?.stereoisomers.total).toBe(2);
    }
    const named = result.records[0]!.findings.find((f) => f.check === 'descriptors-match-structure');
    expect(named?.messageId).toBe('descriptors-at-unstated-units');
    expect(result.records[0]!.passed.map((p) => p.check)).not.toContain('descriptors-match-structure');
    // what the chemist can do: a CXSMILES with 2D coordinates and wedges states an axis too (ChemAxon's CXSMILES
    // format description; test/chem/read/cxsmiles-axes.test.ts), so the advice names it beside the molfile
    for (const f of [form(result.records[0]!), named!]) {
      expect(f.message).toContain('an axis with wedges in a molfile or a CXSMILES with 2D coordinates');
      expect(f.message).not.toMatch(/input format/);
    }
  });

  it('axisOrthoMin from the config reaches the engine: 7 means no axis, so BINOL is achiral as drawn', async () => {
    reg = tmpRegistry({
      'stereogate.config.yml': 'axisOrthoMin: 7\n',
      'compounds/LX-00103.yml': record('LX-00103', "1,1'-bi-2-naphthol", 'achiral'),
    });
    const result = await runAudit({ root: reg.root });
    const r = result.records[0]!;
    expect(r.computed?.units).toEqual([]);
    expect(r.computed?.chiral).toBe(false);
    expect(r.findings.filter((f) => f.severity === 'error')).toEqual([]);
  });
});
