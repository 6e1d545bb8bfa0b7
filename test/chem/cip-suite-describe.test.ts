/**
 * describe() against the CIP validation suite (Hanson, Mayfield, Vainio, Yerin, Musacchio, Redkin, J. Chem. Inf.
 * Model. 2018, 58, 1755–1765; ../shared/data/cip-validation-suite): perception decides which units exist, the
 * labeler labels them. A record scores when describe's labelled units give exactly the suite's labels (none
 * missing, none extra). The floors are today's scores; they may only rise. Helicenes (VS010, VS011) are units of describe since the helix is perceived from the ortho-fused rings.
 */
import { readFileSync } from 'node:fs';
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { readSdRecords } from '../../src/chem/read/index.js';
import { haveSharedData, sharedDataPath } from '../support/shared-data.js';

function score(file: string): { ok: number; total: number; failed: string[] } {
  let ok = 0;
  let total = 0;
  const failed: string[] = [];
  for (const rec of readSdRecords(readFileSync(sharedDataPath('cip-validation-suite', file), 'utf8'))) {
    total++;
    if (!rec.result.ok) {
      failed.push(`record ${rec.record}: unreadable`);
      continue;
    }
    const s = rec.result.structure;
    const want = (s.properties.CIP_LABELS ?? '').split(/\s+/).filter(Boolean).sort();
    const got = describe(s)
      .units.flatMap((u) => (u.label ? u.atoms.map((a) => `${a}${u.label}`) : []))
      .sort();
    if (JSON.stringify(want) === JSON.stringify(got)) ok++;
    else failed.push(`${s.properties.STRUCTURE_ID}: want ${want.join(' ')} got ${got.join(' ')}`);
  }
  return { ok, total, failed };
}

suite.skipIf(!haveSharedData('cip-validation-suite'))('describe() on the CIP validation suite', () => {
  it('2D molfiles: all 300 records exactly right', () => {
    const r = score('compounds_2d.sdf');
    console.log(`describe / CIP suite 2D: ${r.ok}/${r.total}\n  ${r.failed.join('\n  ')}`);
    expect(r.total).toBe(300);
    expect(r.ok).toBe(300);
  });
  it('3D molfiles: all 300 records exactly right', () => {
    const r = score('compounds_3d.sdf');
    console.log(`describe / CIP suite 3D: ${r.ok}/${r.total}\n  ${r.failed.join('\n  ')}`);
    expect(r.ok).toBe(300);
  });
});
