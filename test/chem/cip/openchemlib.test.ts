/**
 * Cross-check against OpenChemLib (npm openchemlib, labels via src/chem/labels.ts `labelWithOpenChemLib`) on the
 * CIP validation suite of Hanson et al. 2018 (J. Chem. Inf. Model. 58, 1755; ../shared/data): every record where
 * the two labelers disagree is listed with the suite's answer. Where they disagree, ours must match the suite at
 * least as often as OpenChemLib does (it scores 178/300 on this suite, SOURCE.md).
 */
import { describe, expect, it } from 'vitest';
import { labelWithOpenChemLib } from '../../../src/chem/labels.js';
import { haveSharedData } from '../../support/shared-data.js';
import { computedLabels, loadSmiles } from './suite.js';

describe.skipIf(!haveSharedData('cip-validation-suite'))('OpenChemLib cross-check (compounds.smi)', () => {
  it('lists disagreements; ours is right more often where the two differ', () => {
    let oursRight = 0;
    let oclRight = 0;
    const lines: string[] = [];
    for (const r of loadSmiles()) {
      if (!r.structure) continue;
      const s = r.structure;
      const mine = computedLabels(s);
      const theirs = [
        ...new Set(
          labelWithOpenChemLib(s)
            .filter((x) => x.label !== null)
            .flatMap((x) => x.atoms.map((a) => `${s.atoms[a].inputNumber}${x.label}`)),
        ),
      ].sort((a, b) => parseInt(a, 10) - parseInt(b, 10) || a.localeCompare(b));
      const same = (a: string[], b: string[]) => a.length === b.length && a.every((x, i) => x === b[i]);
      if (same(mine, theirs)) continue;
      if (same(mine, r.expected)) oursRight++;
      if (same(theirs, r.expected)) oclRight++;
      lines.push(
        `${r.id}: suite [${r.expected.join(' ')}] ours [${mine.join(' ')}] OpenChemLib [${theirs.join(' ')}]`,
      );
    }
    console.log(
      `OpenChemLib disagreements: ${lines.length}; ours right ${oursRight}, OpenChemLib right ${oclRight}\n${lines.join('\n')}`,
    );
    expect(oursRight).toBeGreaterThan(oclRight);
  });
});
