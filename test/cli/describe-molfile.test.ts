/**
 * `stereogate describe` on molfile / SD input, using records of the CIP validation suite (Hanson et al.,
 * J. Chem. Inf. Model. 2018, 58, 1755–1765; ../shared/data/cip-validation-suite/compounds_2d.sdf) with the
 * labels the suite gives.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe as suite, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { haveSharedData, sharedDataPath } from '../support/shared-data.js';
import { memoryIo } from './io.js';

function fullRecord(id: string): string {
  const text = readFileSync(sharedDataPath('cip-validation-suite', 'compounds_2d.sdf'), 'utf8');
  const rec = text.split(/\$\$\$\$\r?\n/).find((r) => r.startsWith(`${id}\n`) || r.startsWith(`${id}\r\n`));
  if (!rec) throw new Error(`record ${id} not in the suite`);
  return rec;
}
/** The molfile part of a suite record. */
const record = (id: string): string => {
  const rec = fullRecord(id);
  return rec.slice(0, rec.indexOf('M  END') + 6) + '\n';
};
/** The suite's labels of a record, e.g. ['4M', '5M']. */
const suiteLabels = (id: string): string[] =>
  (/> *<CIP_LABELS>\r?\n(.*)/.exec(fullRecord(id))?.[1] ?? '').trim().split(/\s+/).filter(Boolean);

async function describeFile(text: string, name: string) {
  const dir = mkdtempSync(join(tmpdir(), 'stereogate-mol-'));
  const file = join(dir, name);
  writeFileSync(file, text);
  const io = memoryIo();
  const code = await run(['describe', file, '--format', 'json'], io);
  return { code, json: JSON.parse(io.stdout.join('\n')) };
}

suite.skipIf(!haveSharedData('cip-validation-suite'))('describe reads molfiles', () => {
  it('VS079, a 1,3-dichloroallene drawn in 2D: one allene unit on the atoms and with the label the suite gives', async () => {
    const r = await describeFile(record('VS079'), 'vs079.mol');
    expect(r.code).toBe(0);
    const want = suiteLabels('VS079');
    expect(want).toHaveLength(2);
    const [unit] = r.json.stereobonds;
    expect(unit.kind).toBe('allene');
    expect([...unit.atoms].sort().map((a: number) => `${a}${unit.label}`)).toEqual(want);
    expect(r.json.chiral).toBe(true);
  });
  it('VS177, an isotopically labelled phosphate: one P stereocentre with the suite label', async () => {
    const r = await describeFile(record('VS177'), 'vs177.mol');
    const [want] = suiteLabels('VS177');
    expect(r.json.stereocenters).toEqual([expect.objectContaining({ element: 'P', defined: true })]);
    expect(`${r.json.stereocenters[0].atom}${r.json.stereocenters[0].label}`).toBe(want);
  });
  it('VS003, dimethyl sulfoxide drawn with a wedge: no stereocentre (two equal methyls; the suite gives no label)', async () => {
    const r = await describeFile(record('VS003'), 'vs003.mol');
    expect(suiteLabels('VS003')).toEqual([]);
    expect(r.json.stereocenters).toEqual([]);
  });
  it('an SD file: the first record is described', async () => {
    const r = await describeFile(`${record('VS079')}$$$$\n${record('VS003')}$$$$\n`, 'two.sdf');
    expect(r.json.stereobonds[0].kind).toBe('allene');
  });
  it('the molfile chiral flag: 1 = absolute configuration, 0 = relative (CTfile format spec, counts line)', async () => {
    const lines = record('VS177').split('\n');
    const withFlag = (flag: string): string => {
      const l = lines.slice();
      l[3] = `${l[3].slice(0, 12)}  ${flag}${l[3].slice(15)}`;
      return l.join('\n');
    };
    expect((await describeFile(withFlag('1'), 'abs.mol')).json.enhanced.meaning).toBe('absolute');
    expect((await describeFile(withFlag('0'), 'rel.mol')).json.enhanced.meaning).toBe('relative');
  });
});
