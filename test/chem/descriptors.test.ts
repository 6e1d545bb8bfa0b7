import { describe, expect, it } from 'vitest';
import { compareDescriptors, parseDescriptors } from '../../src/chem/descriptors.js';
import { centre, unit } from '../checks/facts.js';

const items = (s: string, context?: 'descriptor' | 'name') =>
  parseDescriptors(s, { context }).items.map(
    (i) => `${i.locant ?? ''}${i.pair ?? i.label}${i.axial ? 'a' : ''}${i.relativeStar ? '*' : ''}`,
  );

describe('parseDescriptors: IUPAC 2013 P-93 notation', () => {
  // Source: IUPAC 2013 recommendations P-93.1.3 (R/S with locants, RS/SR, rac-, rel-, R*); examples written in
  // the style of P-93 (from memory, not copied).
  it('reads absolute descriptors with locants', () => {
    const p = parseDescriptors('(2R,3S)');
    expect(p.mode).toBe('absolute');
    expect(items('(2R,3S)')).toEqual(['2R', '3S']);
    expect(p.problems).toEqual([]);
  });
  it('reads racemate notation RS/SR and rac- (P-93.1.3)', () => {
    expect(parseDescriptors('(1RS,2SR)').mode).toBe('racemic');
    expect(items('(1RS,2SR)')).toEqual(['1RS', '2SR']);
    expect(parseDescriptors('rac-(1R,2S)').mode).toBe('racemic');
    expect(parseDescriptors('rac-(1R,2S)').prefixes).toEqual(['rac']);
  });
  it('reads relative notation rel- and R* (P-93.1.3)', () => {
    expect(parseDescriptors('rel-(1R,2S)').mode).toBe('relative');
    expect(parseDescriptors('(1R*,2S*)').mode).toBe('relative');
    expect(items('(1R*,2S*)')).toEqual(['1R*', '2S*']);
  });
  it('remarks when the lowest locant is not cited as R* (P-93.1.3 convention)', () => {
    expect(parseDescriptors('(1S*,2R*)').remarks.join()).toMatch(/lowest-locant/);
    expect(parseDescriptors('(1R*,2S*)').remarks).toEqual([]);
  });
  it('reads E/Z, M/P, axial Ra/Sa and pseudoasymmetric r/s (P-93.4, P-93.5)', () => {
    expect(items('(E)')).toEqual(['E']);
    expect(items('(2Z,4E)')).toEqual(['2Z', '4E']);
    expect(items('(M)')).toEqual(['M']);
    expect(items('(Ra)')).toEqual(['Ra']);
    expect(items('(Sa)')).toEqual(['Sa']);
    expect(items('(2R,3r,4S)')).toEqual(['2R', '3r', '4S']);
  });
  it('reads locants with primes and letters', () => {
    expect(items("(2'R,4aS,8aR)")).toEqual(["2'R", '4aS', '8aR']);
    expect(items('(1\u2032S)')).toEqual(['1\u2032S']);
  });
  it('reads signs of rotation in every spelling', () => {
    expect(parseDescriptors('(+)').rotationSign).toBe('+');
    expect(parseDescriptors('(-)').rotationSign).toBe('-');
    expect(parseDescriptors('(\u2212)').rotationSign).toBe('-');
    expect(parseDescriptors('(±)').rotationSign).toBe('±');
    expect(parseDescriptors('(+/-)').rotationSign).toBe('±');
    expect(parseDescriptors('(±)').mode).toBe('racemic');
  });
  it('reads the front of whole names and returns the rest', () => {
    const menthol = parseDescriptors('(1R,2S,5R)-(\u2212)-menthol', { context: 'name' });
    expect(items('(1R,2S,5R)-(\u2212)-menthol', 'name')).toEqual(['1R', '2S', '5R']);
    expect(menthol.rotationSign).toBe('-');
    expect(menthol.rest).toBe('menthol');
    const carvone = parseDescriptors('(S)-(+)-carvone', { context: 'name' });
    expect([carvone.rotationSign, carvone.rest, carvone.mode]).toEqual(['+', 'carvone', 'absolute']);
    const ibu = parseDescriptors('(±)-ibuprofen', { context: 'name' });
    expect([ibu.mode, ibu.rest]).toEqual(['racemic', 'ibuprofen']);
  });
  it('reads meso, cis/trans and D/L words', () => {
    const meso = parseDescriptors('meso-2,3-dibromobutane', { context: 'name' });
    expect([meso.words, meso.rest]).toEqual([['meso'], '2,3-dibromobutane']);
    expect(parseDescriptors('cis-1,4-dimethylcyclohexane', { context: 'name' }).words).toEqual(['cis']);
    expect(parseDescriptors('trans-stilbene', { context: 'name' }).words).toEqual(['trans']);
    const ala = parseDescriptors('L-alanine', { context: 'name' });
    expect([ala.fischer, ala.mode, ala.items.length]).toEqual(['L', 'none', 0]);
    expect(parseDescriptors('DL-alanine', { context: 'name' }).mode).toBe('racemic');
  });
  it('leaves ordinary name parentheses alone', () => {
    const p = parseDescriptors('(2-chloroethyl)amine', { context: 'name' });
    expect([p.mode, p.rest, p.problems]).toEqual(['none', '(2-chloroethyl)amine', []]);
    expect(parseDescriptors('decane', { context: 'name' }).rest).toBe('decane');
    // 'cis' must be a prefix word, not the start of a word
    expect(parseDescriptors('cisplatin', { context: 'name' }).words).toEqual([]);
  });
  it('notices descriptors embedded further into a name', () => {
    expect(
      parseDescriptors('(R)-2-[(S)-1-hydroxyethyl]pyrrolidine', { context: 'name' }).embeddedDescriptors,
    ).toBe(true);
    expect(parseDescriptors('(R)-butan-2-ol', { context: 'name' }).embeddedDescriptors).toBe(false);
  });
  it('reports problems with character positions', () => {
    const bad = parseDescriptors('(2R,3Q)');
    expect(bad.problemDetails).toEqual([{ offset: 4, message: expect.stringContaining("'3Q'") }]);
    expect(bad.problems[0]).toMatch(/^at character 4:/);
    expect(parseDescriptors('(2R').problemDetails[0].offset).toBe(0);
    expect(parseDescriptors('(2R,2S)').problemDetails[0].message).toMatch(/twice/);
    expect(parseDescriptors('(2R,3S)-(+)-(-)').problemDetails[0].message).toMatch(/conflicting signs/);
    expect(parseDescriptors('(1R*,2S)').problemDetails[0].message).toMatch(/\*/);
    // 'rel-' alone and '(±)' before absolute descriptors are read (with a remark), not rejected: see below
    expect(parseDescriptors('rel-').problemDetails).toEqual([]);
    expect(parseDescriptors('rel-').remarks[0]).toMatch(/states no configuration/);
    expect(parseDescriptors('(±)-(R)')).toMatchObject({ mode: 'racemic', problemDetails: [] });
    expect(parseDescriptors('(2R,3S) extra').problemDetails[0]).toEqual({
      offset: 8,
      message: expect.any(String),
    });
  });
  it('never throws on arbitrary text (bad input is data)', () => {
    for (const s of [
      '',
      '(',
      ')',
      '((R))',
      '(,)',
      'rac',
      '(R)-',
      '-(R)',
      '(1R,)',
      '[2S]',
      '(+/-',
      '\u0000(R)',
    ]) {
      expect(() => parseDescriptors(s)).not.toThrow();
      expect(() => parseDescriptors(s, { context: 'name' })).not.toThrow();
    }
  });
});

describe('compareDescriptors', () => {
  const tartaric = [centre(4, 'R', 2), centre(6, 'R', 3)];
  it('compares per locant when the structure carries atom maps', () => {
    const ok = compareDescriptors(parseDescriptors('(2R,3R)'), tartaric);
    expect([ok.method, ok.agrees]).toEqual(['per-locant', true]);
    const bad = compareDescriptors(parseDescriptors('(2R,3S)'), tartaric);
    expect(bad.agrees).toBe(false);
    expect(bad.mismatches).toEqual([{ locant: '3', declared: 'S', computed: 'R', atoms: [6] }]);
  });
  it('reports locants that are no stereo unit, undefined units and uncited units', () => {
    const units = [centre(4, 'R', 2), unit({ atoms: [6], defined: false, locants: [3] }), centre(8, 'S', 5)];
    const c = compareDescriptors(parseDescriptors('(2R,3S,4R)'), units);
    expect([c.notStereoUnits, c.undefinedAt, c.unlisted.map((u) => u.locant)]).toEqual([['4'], ['3'], ['5']]);
  });
  it('falls back to counts without atom maps, and says why', () => {
    const units = [centre(4, 'R'), centre(6, 'S')];
    const c = compareDescriptors(parseDescriptors('(2S,3R)'), units);
    expect([c.method, c.agrees]).toEqual(['counts', true]);
    expect(c.whyNotPerLocant).toMatch(/atom-map/);
    expect(compareDescriptors(parseDescriptors('(2R,3R)'), units).agrees).toBe(false);
  });
  it('falls back to counts for locants with letters or primes', () => {
    const c = compareDescriptors(parseDescriptors('(4aR,8aS)'), [centre(1, 'R', 4), centre(2, 'S', 8)]);
    expect([c.method, c.whyNotPerLocant]).toEqual([
      'counts',
      'not every descriptor has a plain numeric locant',
    ]);
  });
  // IUPAC 2013 P-93.1.3: rel/R* and RS/SR describe the drawn stereoisomer or its mirror image.
  it('compares relative and racemic descriptors up to overall inversion', () => {
    const drawn = [centre(2, 'S', 1), centre(3, 'R', 2)];
    for (const d of ['rel-(1R,2S)', '(1R*,2S*)', '(1RS,2SR)', 'rac-(1R,2S)']) {
      const c = compareDescriptors(parseDescriptors(d), drawn);
      expect([d, c.agrees, c.matchedInverted]).toEqual([d, true, true]);
    }
    expect(compareDescriptors(parseDescriptors('(1R,2S)'), drawn).agrees).toBe(false);
    // inversion never turns a cis relation (R*,R*) into a trans one (R*,S*)
    expect(compareDescriptors(parseDescriptors('rel-(1R,2R)'), drawn).agrees).toBe(false);
  });
  it('keeps E/Z and pseudoasymmetric r/s under inversion', () => {
    const units = [
      centre(2, 'R', 2),
      unit({ atoms: [4, 5], kind: 'double-bond', label: 'E', locants: [4, 5] }),
    ];
    expect(compareDescriptors(parseDescriptors('rel-(2S,4E)'), units).agrees).toBe(true);
    expect(compareDescriptors(parseDescriptors('rel-(2S,4Z)'), units).agrees).toBe(false);
  });
  it('matches a double bond by its lower locant', () => {
    const units = [unit({ atoms: [2, 3], kind: 'double-bond', label: 'Z', locants: [2, 3] })];
    expect(compareDescriptors(parseDescriptors('(2Z)'), units).agrees).toBe(true);
    expect(compareDescriptors(parseDescriptors('(2E)'), units).agrees).toBe(false);
  });
  // from memory (Eliel & Wilen 1994): Ra corresponds to M, Sa to P
  it('reads axial Ra/Sa against M/P labels', () => {
    const axis = [unit({ atoms: [1, 3], kind: 'allene', label: 'M' })];
    expect(compareDescriptors(parseDescriptors('(Ra)'), axis).agrees).toBe(true);
    expect(compareDescriptors(parseDescriptors('(Sa)'), axis).agrees).toBe(false);
    expect(compareDescriptors(parseDescriptors('(M)'), axis).agrees).toBe(true);
  });
  // meso-2,3-dibromobutane is (2R,3S) numbered from one end and (2S,3R) from the other (IUPAC Gold Book, meso):
  // for an achiral structure the comparison allows overall inversion.
  it('compares the descriptors of an achiral (meso) structure up to inversion', () => {
    const meso = [centre(2, 'S', 2), centre(4, 'R', 3)];
    expect(compareDescriptors(parseDescriptors('(2R,3S)'), meso).agrees).toBe(false);
    expect(compareDescriptors(parseDescriptors('(2R,3S)'), meso, { achiral: true }).agrees).toBe(true);
    expect(compareDescriptors(parseDescriptors('(2R,3R)'), meso, { achiral: true }).agrees).toBe(false);
  });
  it('has nothing to compare for a descriptor without configurations', () => {
    expect(compareDescriptors(parseDescriptors('(+)'), tartaric).method).toBe('none');
  });
});

describe('stereo prefixes in names, read as chemists write them (issue 12)', () => {
  const name = (n: string) => parseDescriptors(n, { context: 'name' });
  // IUPAC 2013 P-93.1.3: a racemate is named with the prefix rac- or the descriptors RS/SR; (±) is also used.
  it('rac- with no descriptors names a racemate (P-93.1.3); before: an error "must be followed by descriptors"', () => {
    expect(name('rac-ibuprofen')).toMatchObject({ mode: 'racemic', problems: [], rest: 'ibuprofen' });
    expect(name('rac-(2R)-2-phenylpropanoic acid')).toMatchObject({ mode: 'racemic', problems: [] });
  });
  it('(RS) and legacy (R,S) / (S,R) / (R/S) without locants read as RS (P-93.1.3 writes RS); before: two items R and S', () => {
    expect(items('(RS)-ibuprofen', 'name')).toEqual(['RS']);
    expect(items('(R,S)-ibuprofen', 'name')).toEqual(['RS']);
    expect(items('(S,R)-ibuprofen', 'name')).toEqual(['SR']);
    expect(items('(R/S)-ibuprofen', 'name')).toEqual(['RS']);
    expect(name('(R,S)-ibuprofen')).toMatchObject({ mode: 'racemic', problems: [], rest: 'ibuprofen' });
    expect(name('(R,S)-ibuprofen').remarks[0]).toMatch(/legacy way of naming a racemate/);
    // with locants these are two centres, not a racemate
    expect(items('(1R,2S)-ephedrine', 'name')).toEqual(['1R', '2S']);
    expect(name('(1R,2S)-ephedrine').mode).toBe('absolute');
    // same letter twice is no racemate
    expect(items('(R,R)-x', 'name')).toEqual(['R', 'R']);
  });
  it('(±) names a racemate; with descriptors of one enantiomer it is read as rac- (P-93.1.3)', () => {
    expect(name('(±)-ibuprofen')).toMatchObject({ mode: 'racemic', rotationSign: '±', problems: [] });
    expect(name('(±)-(1R,2S)-ephedrine')).toMatchObject({ mode: 'racemic', problems: [] });
    expect(name('(+/-)-ibuprofen').rotationSign).toBe('±');
  });
  it('rel- and * give relative configuration (P-93.1.3)', () => {
    expect(name('rel-(1R,2S)-2-methylcyclohexan-1-ol').mode).toBe('relative');
    expect(name('(1R*,2S*)-2-methylcyclohexan-1-ol').mode).toBe('relative');
    // rac with starred descriptors: read as racemic, with a remark (P-93.1.3 uses one notation)
    expect(name('rac-(1R*,2S*)-x')).toMatchObject({ mode: 'racemic', problems: [] });
  });
  it('(+)/(−) give the sign of rotation, whatever dash stands for the minus (issue 10)', () => {
    expect(name('(+)-carvone').rotationSign).toBe('+');
    expect(name('(\uFF0B)-carvone').rotationSign).toBe('+'); // fullwidth plus
    for (const minus of ['-', '\u2010', '\u2011', '\u2012', '\u2013', '\u2014', '\u2212', '\uFE63', '\uFF0D', '\u02D7']) {
      const p = name(`(${minus})-menthol`);
      expect([minus.codePointAt(0)!.toString(16), p.rotationSign, p.rest]).toEqual([
        minus.codePointAt(0)!.toString(16),
        '-',
        'menthol',
      ]);
      // and as the hyphen after a prefix
      expect(name(`(S)${minus}carvone`).rest).toBe('carvone');
    }
    expect(name('(+/\u2014)-ibuprofen').rotationSign).toBe('±');
  });
  it('D-/L- (Fischer–Rosanoff, P-102/P-103, from memory), DL- a racemate; cis-/trans-, meso-, erythro/threo as words', () => {
    expect(name('L-alanine')).toMatchObject({ fischer: 'L', mode: 'none', rest: 'alanine' });
    expect(name('DL-alanine')).toMatchObject({ fischer: 'DL', mode: 'racemic' });
    expect(name('cis-but-2-ene').words).toEqual(['cis']);
    expect(name('meso-2,3-dibromobutane').words).toEqual(['meso']);
    // erythro/threo: IUPAC Gold Book (relative configuration of two adjacent stereocentres)
    expect(name('threo-methylphenidate')).toMatchObject({ words: ['threo'], rest: 'methylphenidate' });
    expect(name('(±)-threo-methylphenidate')).toMatchObject({ words: ['threo'], mode: 'racemic' });
  });
  it('the rest is a name: a name that says nothing stereo says nothing', () => {
    for (const n of ['ibuprofen', 'Lidocaine', '(2-chloroethyl)amine', 'S-methyl ethanethioate', 'Dl-x']) {
      const p = name(n);
      expect([n, p.mode, p.items, p.rotationSign, p.problems]).toEqual([n, 'none', [], null, []]);
    }
  });
});
