/**
 * One-click fixes (issue 15): where the drawn structure decides the correction — wrong descriptors, a form word, a
 * (+)/(−) sign that contradicts the measured rotation — the inline comment carries a GitHub suggested change that
 * replaces the record's line. Tested on the rendered comment text, and by accepting each suggestion: the corrected
 * record must pass the check that made it. Measured values (ee, ratio, rotation) never get one.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import type { AuditResult } from '../../src/audit/types.js';
import { planInlineComments } from '../../src/github/inline-plan.js';
import { parsePatch } from '../../src/github/patch.js';
import { fileLines, fixLine, suggestionBlock } from '../../src/github/suggestion.js';

// Chemistry of the records, with sources:
// - (2R,3S)-tartaric acid OC(=O)[C@@H](O)[C@@H](O)C(=O)O is meso (CIP labels S,R from RDKit 2022.09 rdCIPLabeler;
//   meso: achiral member of a set with chiral members, IUPAC Gold Book "meso-compound").
// - Ethanol has no stereogenic unit (common knowledge, from memory).
// - C[C@@H:3](O)[C@H:2](N)C(=O)O is L-threonine, (2S,3R) (RDKit rdCIPLabeler: map 2 S, map 3 R).
// - C[C@@H](O)CC is (R)-butan-2-ol (RDKit rdCIPLabeler: R); its rotation at 589 nm is negative, about −13.5°
//   (from memory).
const RECORDS: Record<string, string> = {
  'LX-00101.yaml':
    'id: LX-00101\nname: "2,3-dihydroxybutanedioic acid"\nstructure:\n  smiles: "OC(=O)[C@@H](O)[C@@H](O)C(=O)O"\n' +
    'stereo:\n  form: racemate\n',
  'LX-00102.yaml':
    'id: LX-00102\nname: ethanol\nstructure:\n  smiles: CCO\nstereo:\n  form: single-enantiomer\n',
  'LX-00103.yaml':
    'id: LX-00103\nname: threonine\nstructure:\n  smiles: "C[C@@H:3](O)[C@H:2](N)C(=O)O"\nstereo:\n' +
    '  form: single-enantiomer\n  descriptors: "(2S,3S)" # as submitted\n',
  'LX-00104.yaml':
    "id: LX-00104\nname: butan-2-ol\nstructure:\n  smiles: 'C[C@@H](O)CC'\nstereo:\n  form: single-enantiomer\n" +
    "  descriptors: '(S)'\n",
  'LX-00105.yaml':
    'id: LX-00105\nname: "(+)-butan-2-ol"\nstructure:\n  smiles: "C[C@@H](O)CC"\nstereo:\n  form: single-enantiomer\n' +
    '  rotation:\n    value: -13.5\n    wavelength_nm: 589\n',
  'LX-00106.json':
    '{\n  "id": "LX-00106",\n  "name": "ethanol",\n  "structure": { "smiles": "CCO" },\n  "stereo": {\n' +
    '    "form": "single-enantiomer"\n  }\n}\n',
};

/** The suggested line expected for each record: [check, line as it must read after accepting]. */
const EXPECTED: Record<string, [string, string]> = {
  'LX-00101.yaml': ['form-matches-structure', '  form: meso'],
  'LX-00102.yaml': ['form-matches-structure', '  form: achiral'],
  'LX-00103.yaml': ['descriptors-match-structure', '  descriptors: "(2S,3R)" # as submitted'],
  'LX-00104.yaml': ['descriptors-match-structure', "  descriptors: '(R)'"],
  'LX-00105.yaml': ['rotation-consistent', 'name: "(-)-butan-2-ol"'],
  'LX-00106.json': ['form-matches-structure', '    "form": "achiral"'],
};

let root: string;
let audit: AuditResult;
beforeAll(async () => {
  root = mkdtempSync(join(tmpdir(), 'stereogate-fixes-'));
  mkdirSync(join(root, 'compounds'));
  for (const [file, text] of Object.entries(RECORDS)) writeFileSync(join(root, 'compounds', file), text);
  audit = await runAudit({ root });
});
afterAll(() => rmSync(root, { recursive: true, force: true }));

/** Every line of every record added in the pull request, as a new file's diff shows it. */
function allAdded(): Map<string, ReturnType<typeof parsePatch>> {
  const diffs = new Map<string, ReturnType<typeof parsePatch>>();
  for (const [file, text] of Object.entries(RECORDS)) {
    const lines = fileLines(text.replace(/\n$/, ''));
    diffs.set(
      `compounds/${file}`,
      parsePatch(`@@ -0,0 +1,${lines.length} @@\n${lines.map((l) => `+${l}`).join('\n')}`),
    );
  }
  return diffs;
}

describe('suggested changes in inline comments', () => {
  it('renders a suggestion block that replaces the claim line, for each certain fix', () => {
    const sources = new Map(Object.entries(RECORDS).map(([f, t]) => [`compounds/${f}`, t]));
    const plan = planInlineComments(audit, allAdded(), { registryDir: '', max: 50, sources });
    for (const [file, [check, fixed]] of Object.entries(EXPECTED)) {
      const record = audit.records.find((r) => r.file.endsWith(file))!;
      const withFix = record.findings.find((f) => f.check === check && f.fix !== undefined);
      expect(withFix, `${file}: ${record.findings.map((f) => f.messageId).join(', ')}`).toBeDefined();
      const comment = plan.comments.find((c) => c.path === `compounds/${file}` && c.line === withFix!.line)!;
      expect(comment, file).toBeDefined();
      // What GitHub shows as a one-click change: the fenced block with exactly the corrected line.
      expect(comment.body, file).toContain(`\`\`\`suggestion\n${fixed}\n\`\`\``);
      expect(comment.body).toMatch(/accept it if the drawing is right/);
    }
  });

  it('accepting each suggestion makes the record pass the check that made it', async () => {
    const sources = new Map(Object.entries(RECORDS).map(([f, t]) => [`compounds/${f}`, t]));
    const plan = planInlineComments(audit, allAdded(), { registryDir: '', max: 50, sources });
    for (const comment of plan.comments) {
      const block = /```suggestion\n([^\n]*)\n```/.exec(comment.body);
      if (block === null) continue;
      const file = join(root, comment.path);
      const lines = fileLines(readFileSync(file, 'utf8'));
      lines[comment.line - 1] = block[1]!;
      writeFileSync(file, lines.join('\n'));
    }
    const after = await runAudit({ root });
    for (const [file, [check]] of Object.entries(EXPECTED)) {
      const record = after.records.find((r) => r.file.endsWith(file))!;
      expect(
        record.findings.filter((f) => f.check === check && f.severity !== 'note').map((f) => f.messageId),
        file,
      ).toEqual([]);
    }
  });

  it('never offers a fix for a measured value (ee, ratio, rotation) in the demo registry', async () => {
    const demo = await runAudit({ root: 'fixtures/demo-registry' });
    const fixed = demo.records.flatMap((r) => r.findings).filter((f) => f.fix !== undefined);
    expect(fixed.length).toBeGreaterThan(0);
    for (const f of fixed) {
      expect(f.fix!.field).not.toMatch(/ratio|(^|\.)ee$|rotation/);
      expect(['stereo.form', 'stereo.descriptors', 'name']).toContain(f.fix!.field.replace(/\.\d+\./, '.'));
    }
  });
});

describe('fixLine', () => {
  const fix = (field: string, from: string, to: string) => ({ field, from, to });
  it('keeps quoting, comments, list dashes and JSON commas', () => {
    expect(fixLine('  form: racemate', fix('stereo.form', 'racemate', 'meso'))).toBe('  form: meso');
    expect(fixLine('  "form": "racemate",', fix('stereo.form', 'racemate', 'meso'))).toBe(
      '  "form": "meso",',
    );
    expect(fixLine("name: '(+)-menthol' # d", fix('name', '(+)', '(-)'))).toBe("name: '(-)-menthol' # d");
    expect(fixLine('  - descriptors: "(R)"', fix('stereo.components.0.descriptors', '(R)', '(S)'))).toBe(
      '  - descriptors: "(S)"',
    );
  });
  it('refuses what it cannot do with certainty', () => {
    expect(fixLine('  form: >-', fix('stereo.form', 'racemate', 'meso'))).toBeNull(); // value on the next line
    expect(fixLine('  ratio: racemate', fix('stereo.form', 'racemate', 'meso'))).toBeNull(); // another key
    expect(fixLine('name: "(R)-x (R)"', fix('name', '(R)', '(S)'))).toBeNull(); // ambiguous: twice
    expect(fixLine('name: "\\u0028+)-x"', fix('name', '(+)', '(-)'))).toBeNull(); // escaped in the file
    // the new value would need quoting that a plain scalar lacks
    expect(fixLine('name: x', fix('name', 'x', 'a: b'))).toBeNull();
  });
  it('fences a line holding backticks with a longer fence', () => {
    expect(suggestionBlock('name: "``(+)``-x"\n', 1, [fix('name', '(+)', '(-)')])).toBe(
      '```suggestion\nname: "``(-)``-x"\n```',
    );
  });
});
