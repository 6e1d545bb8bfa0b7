import { describe, expect, it } from 'vitest';
import { structureReadable as check } from '../../src/checks/structure-readable.js';
import { ctx, facts, failedRead, loaded, read, record, runCheck, ids } from './facts.js';

describe('structure-readable', () => {
  it('passes a readable structure, with evidence', () => {
    const o = runCheck(check, ctx({ main: read(facts({ formula: 'C4H10O' })) }));
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/C4H10O/);
  });
  it('turns a SMILES reader error into a finding with the character offset', () => {
    const o = runCheck(check, ctx({ main: failedRead('SMILES: ring bond 1 is never closed', null, 4) }));
    expect(ids(o)).toEqual(['structure-unreadable']);
    expect(o.findings[0].field).toBe('structure.smiles');
    expect(o.findings[0].data).toMatchObject({ errorOffset: 4, errorLine: null });
  });
  it('turns a molfile reader error into a finding with the molfile line', () => {
    const r = record({}, { structure: { molfile: 'LX-00001.mol' } });
    const o = runCheck(check, ctx({ record: r, main: failedRead('molfile: bad counts line', 4, null) }));
    expect(o.findings[0]).toMatchObject({ messageId: 'structure-unreadable', field: 'structure.molfile' });
    expect(o.findings[0].data.errorLine).toBe(4);
  });
  it('reports a molfile path the loader refused, once', () => {
    const r = record({}, { structure: { molfile: '../../etc/passwd' } });
    const l = loaded(r);
    l.sources = {
      main: {
        field: 'structure',
        format: 'molfile',
        text: null,
        error: "'../../etc/passwd' leaves the registry folder",
      },
      components: [],
    };
    const o = runCheck(
      check,
      ctx({
        record: r,
        loaded: l,
        main: failedRead("'../../etc/passwd' leaves the registry folder", null, null),
      }),
    );
    expect(ids(o)).toEqual(['structure-source-refused']);
  });
  it('catches an escaping molfile path even without the loader (defence in depth)', () => {
    const r = record({}, { structure: { molfile: '../../secret.mol' } });
    const o = runCheck(check, ctx({ record: r, main: read(facts()) }));
    expect(ids(o)).toEqual(['molfile-path-outside']);
    expect(o.findings[0].data.resolved).toBe('../secret.mol');
    const inside = record({}, { structure: { molfile: '../compounds/x.mol' } });
    expect(runCheck(check, ctx({ record: inside, main: read(facts()) })).findings).toEqual([]);
  });
  it('reports unreadable components by index', () => {
    const r = record({ form: 'diastereomer-mixture', components: [{ smiles: 'C' }, { smiles: 'C1' }] });
    const o = runCheck(
      check,
      ctx({ record: r, components: [read(facts()), failedRead('unclosed ring', null, 1)] }),
    );
    expect(o.findings).toMatchObject([
      { messageId: 'component-unreadable', field: 'stereo.components.1.smiles', data: { index: 2 } },
    ]);
  });
  it('leaves remarks on invertible amine nitrogens to nitrogen-inversion, unless it is switched off', () => {
    const f = facts({
      invertibleNitrogens: [{ atom: 3, drawnWithStereo: true }],
      remarks: [
        'configuration drawn on N3, an ordinary amine nitrogen: it inverts rapidly',
        'wedge on atom 7',
      ],
    });
    const o = runCheck(check, ctx({ main: read(f) }));
    expect(o.findings.map((x) => x.data.remark)).toEqual(['wedge on atom 7']);
    const off = runCheck(
      check,
      ctx({ main: read(f), config: { severities: { 'nitrogen-inversion': 'off' } } }),
    );
    expect(off.findings).toHaveLength(2);
  });
  it('passes reader remarks on as notes without failing the check', () => {
    const o = runCheck(check, ctx({ main: read(facts({ remarks: ['wedge on a non-stereogenic atom 7'] })) }));
    expect(o.findings).toMatchObject([{ messageId: 'reader-remark', severity: 'note' }]);
    expect(o.passed).toBeDefined();
  });
  // bis(amphetamine) sulfate, (C9H13N)2·H2SO4, a 2:1 salt (handbook, from memory): the copies are its
  // stoichiometry, not a drawing error; two copies with nothing else are worth a look (issue 12: notes to act on)
  it('copies of the parent in a salt go to the evidence; copies alone stay a note', () => {
    const remark =
      '2 identical copies of the parent (C9H13N): stereoisomer counts and chirality are those of one copy';
    const comp = (index: number, role: 'parent' | 'other', formula: string) => ({
      index,
      formula,
      heavyAtoms: 10,
      role,
      smiles: '',
    });
    const salt = facts({
      remarks: [remark],
      components: [comp(0, 'parent', 'C9H13N'), comp(1, 'parent', 'C9H13N'), comp(2, 'other', 'H2O4S')],
    });
    const o = runCheck(check, ctx({ main: read(salt) }));
    expect(o.findings).toEqual([]);
    expect(o.passed).toMatch(/2 identical copies of the parent \(C9H13N\) \(a salt\)/);
    const alone = facts({
      remarks: [remark],
      components: [comp(0, 'parent', 'C9H13N'), comp(1, 'parent', 'C9H13N')],
    });
    expect(runCheck(check, ctx({ main: read(alone) })).findings).toMatchObject([
      { messageId: 'reader-remark', severity: 'note' },
    ]);
  });
  it('still runs when the record failed the schema', () => {
    const o = runCheck(check, ctx({ record: null, main: failedRead('no structure', null, null) }));
    expect(ids(o)).toEqual(['structure-unreadable']);
  });
});
