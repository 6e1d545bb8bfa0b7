import { describe, expect, it } from 'vitest';
import { CHECKS } from '../../src/checks/index.js';
import { WAIVER_CHECK_ID } from '../../src/checks/waivers.js';

describe('CHECKS', () => {
  it('lists modules with unique kebab-case ids, summaries, explanations and message templates', () => {
    const ids = CHECKS.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const c of CHECKS) {
      expect(c.id).toMatch(/^[a-z]+(-[a-z]+)+$/);
      expect(['error', 'warning', 'note']).toContain(c.defaultSeverity);
      expect(c.summary.length).toBeGreaterThan(20);
      expect(c.explanation.length).toBeGreaterThan(100);
      for (const [id, text] of Object.entries(c.messages)) {
        expect(id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/);
        expect(text.length).toBeGreaterThan(10);
      }
    }
  });
  it('runs the waiver review last, so it sees every other finding', () => {
    expect(CHECKS[CHECKS.length - 1].id).toBe(WAIVER_CHECK_ID);
  });
  it('names a source or says "no source" in every explanation', () => {
    for (const c of CHECKS) {
      expect([
        c.id,
        /IUPAC|Gold Book|specification|no source|from memory|OpenSMILES|CTfile/.test(c.explanation),
      ]).toEqual([c.id, true]);
    }
  });
});
