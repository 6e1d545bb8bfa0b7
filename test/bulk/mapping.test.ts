import { describe, expect, it } from 'vitest';
import { makeVocabulary, VocabularyTally } from '../../src/bulk/mapping.js';
import { parseNumber, parseRotation, toRecord } from '../../src/bulk/to-record.js';

describe('legacy form vocabulary (common practice, no source)', () => {
  const vocab = makeVocabulary({ 'rs-mix': 'racemate' });
  it.each([
    ['rac', 'racemate'],
    ['RAC', 'racemate'],
    ['racemic', 'racemate'],
    ['(+/-)', 'racemate'],
    ['(±)', 'racemate'],
    ['Single Enantiomer', 'single-enantiomer'],
    ['single_enantiomer', 'single-enantiomer'],
    ['MESO', 'meso'],
    ['rs-mix', 'racemate'],
  ])('%s -> %s', (word, form) => {
    expect(vocab(word).form).toBe(form);
    expect(vocab(word).how).toBe('mapped');
  });
  it('our own words pass as ours; unknown words are not guessed', () => {
    expect(vocab('diastereomer-mixture')).toEqual({ form: 'diastereomer-mixture', how: 'ours' });
    expect(vocab('chiral')).toEqual({ form: null, how: 'not-understood' });
    expect(vocab('   ')).toEqual({ form: null, how: 'empty' });
  });
  it('tallies mapped and not-understood words and merges tallies', () => {
    const a = new VocabularyTally();
    a.add('rac', vocab('rac'));
    a.add('rac', vocab('rac'));
    a.add('chiral', vocab('chiral'));
    const b = new VocabularyTally();
    b.merge(a.toJSON());
    b.merge(a.toJSON());
    expect(b.toJSON()).toEqual({
      mapped: [['rac', { form: 'racemate', count: 4 }]],
      notUnderstood: [['chiral', 2]],
    });
  });
});

describe('bulk field conversion', () => {
  const vocab = makeVocabulary();
  it('reads numbers written the ways registries write them', () => {
    expect(parseNumber('99.5 %')).toBe(99.5);
    expect(parseNumber('99,5')).toBe(99.5);
    expect(parseNumber('n/a')).toBeNull();
    expect(parseRotation('\u22125.1 (c 1.0, CHCl3)')).toBe(-5.1);
    expect(parseRotation('+12.3°')).toBe(12.3);
  });
  it('maps a CSV row onto a record', () => {
    const row = { REG: 'LX-1', SMILES: 'C[C@H](O)CC', Stereo: 'rac', EE: '0', ROT: '+0.1' };
    const r = toRecord(
      row,
      'x#1',
      { id: 'REG', structure: 'SMILES', form: 'Stereo', ee: 'EE', rotation: 'ROT' },
      vocab,
      null,
    );
    expect(r.problems).toEqual([]);
    expect(r.record).toEqual({
      id: 'LX-1',
      structure: { smiles: 'C[C@H](O)CC' },
      stereo: { form: 'racemate', ee: 0, rotation: { value: 0.1 } },
    });
    expect(r.formHow).toBe('mapped');
  });
  it('reports what is missing or not understood, with the field', () => {
    const r = toRecord({ id: 'LX-2', stereo_form: 'chiral', ee: 'high' }, 'x#2', {}, vocab, null);
    expect(r.problems.map((p) => p.path)).toEqual(['structure', 'stereo.form', 'stereo.ee']);
    expect(r.record.stereo.form).toBe('unknown');
  });
});
