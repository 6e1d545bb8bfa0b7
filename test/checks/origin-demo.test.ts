/**
 * The demo registry's synthesis sequences (LX-00201..LX-00210, the invented Larkspur Chemistry Lab) as a chemist
 * reads them in the pull-request checklist: the rendered Markdown gives, for each record with an origin, the
 * expected outcome with its reason beside the declared claim, and the one wrong drawing as an open error.
 */
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import { renderMarkdown } from '../../src/report/markdown.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'fixtures', 'demo-registry');
const SEQUENCE = ['LX-00202', 'LX-00203', 'LX-00205', 'LX-00206', 'LX-00208', 'LX-00210'];

let md = '';
beforeAll(async () => {
  const result = await runAudit({ root: ROOT, paths: SEQUENCE.map((id) => `compounds/${id}.yml`) });
  md = renderMarkdown(result);
}, 120_000);

const block = (id: string): string => {
  const start = md.indexOf(`compounds/${id}.yml`);
  const next = SEQUENCE.map((x) => md.indexOf(`compounds/${x}.yml`)).filter((i) => i > start);
  return start < 0 ? '' : md.slice(start, next.length ? Math.min(...next) : undefined);
};

describe('origin in the demo checklist', () => {
  it('NaBH4 product: racemate expected, with the reason, beside the declared racemate', () => {
    expect(block('LX-00202')).toMatch(
      /`origin-supports-claim`: expected racemate — no source of enantiomeric bias .*enantiomeric transition states are equal in energy; declared racemate/,
    );
  });
  it('enzymatic desymmetrisation: the biocatalyst named as the source of the excess', () => {
    expect(block('LX-00208')).toMatch(
      /expected enantioenriched; C6 \(atom 5\) and C1 \(atom 10\) as in LX-00207 — the biocatalyst is the source of enantiomeric bias; declared enantioenriched \(1S,6R\)/,
    );
  });
  it('Grignard addition: unequal diastereomers expected, the carried centre as in the aldehyde', () => {
    expect(block('LX-00210')).toMatch(
      /expected non-racemic, C3 \(atom 2\) as in LX-00209, ee at most 98\.5%; diastereomers at C \(atom 9\) in unequal amounts — .*; declared diastereomer-mixture/,
    );
  });
  it('the ester drawn as the mirror image of its input is an open error, naming the input', () => {
    expect(block('LX-00206')).toMatch(
      /error\*\* `origin-supports-claim` \(line \d+\): .*carried from LX-00205.*mirror-image arrangement/,
    );
  });
});
