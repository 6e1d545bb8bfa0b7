/**
 * Check: stereo.ratio and stereo.ee against each other, the components and the declared form.
 */
import type { CheckContext, CheckModule, CheckOutcome, RawFinding } from './types.js';
import { eeFromRatio, parseRatio } from './ratio.js';
import { finding, fmt } from './words.js';

const messages = {
  'ratio-unreadable':
    "The ratio '{ratio}' could not be read: {problem} (at character {offset}). Write it as parts separated by " +
    'colons, e.g. 70:30 or 97.5:2.5.',
  'ratio-parts-not-100':
    'The ratio {ratio} reads as percentages but its parts sum to {sum}, not 100 (tolerance ±{tolerance}). Correct ' +
    'the parts; if relative amounts were meant, write them as small whole numbers (e.g. 2:1).',
  'ratio-components-count':
    'The ratio {ratio} has {parts:part|parts} but stereo.components lists {components}; the parts are read in the ' +
    'order of the components. Give one part per component.',
  'enantiomer-ratio-parts':
    'The ratio {ratio} has {parts:part|parts}, but a {form} consists of two enantiomers. Give the enantiomer ratio ' +
    'as two parts (e.g. 97:3).',
  'racemate-ratio-not-even':
    'Declared racemate, but the ratio {ratio} is {deviation} points away from 50:50 (tolerance ±{tolerance}); that ' +
    'is an enantioenriched sample with ee {ee}%. Check the measurement, or declare enantioenriched with the ee.',
  'racemate-ee-not-zero':
    'Declared racemate, but the stated ee is {ee}% (a racemate has ee 0 within ±{tolerance}). Declare enantioenriched, or ' +
    'correct the ee.',
  'ee-disagrees-with-ratio':
    'The stated ee {ee}% does not agree with the ratio {ratio}, which gives ee = |a − b| / (a + b) · 100 = ' +
    '{computedEe}% (tolerance ±{tolerance}). Correct one of them.',
  'single-enantiomer-ee-low':
    'Declared single-enantiomer, but the ee is {ee}% ({source}), below the registry threshold of {threshold}%. ' +
    'Declare enantioenriched with the ee, or record the measurement that shows the higher purity.',
  'enantioenriched-ee-zero':
    'Declared enantioenriched, but the ee is {ee}% ({source}), which is a racemate within tolerance (±{tolerance}). ' +
    'Declare racemate, or correct the ee.',
  'ee-for-achiral-form':
    'An ee of {ee}% is given, but the form is {form}: an achiral or meso compound has no enantiomers, so it has no ' +
    'enantiomeric excess. Remove the ee, or correct the form.',
  'diastereomer-ratio-exactly-even':
    'The diastereomer mixture is reported at exactly {ratio}. Diastereomers differ in energy and normally form in ' +
    'unequal amounts (only enantiomers, with equal energies, come out 50:50 from achiral conditions). Was the ratio ' +
    'measured (NMR integration, HPLC), or assumed? Record the measured ratio.',
} as const;

type Id = keyof typeof messages;

/**
 * The question about an even diastereomer ratio is chemistry only for diastereomers: when two listed components
 * are in fact enantiomers (or identical, or unrelated), form-matches-structure reports that, and 1:1 is then
 * what a racemate is. Components that could not be read are left out; none listed counts as diastereomers, as
 * declared.
 */
function componentsAreDiastereomers(ctx: CheckContext): boolean {
  const s = ctx.components.map((c) => c.structure).filter((x) => x !== null);
  for (let i = 0; i < s.length; i++) {
    for (let j = i + 1; j < s.length; j++) {
      if (ctx.engine.relate(s[i], s[j]).relation !== 'diastereomers') return false;
    }
  }
  return true;
}

function run(ctx: CheckContext): CheckOutcome {
  const record = ctx.record;
  if (!record) return { findings: [], notApplicable: 'the record was not read' };
  const { form, ratio, ee, components } = record.stereo;
  if (ratio === undefined && ee === undefined)
    return { findings: [], notApplicable: 'no ratio or ee declared (stereo.ratio, stereo.ee)' };
  const cfg = ctx.config;
  const out: RawFinding[] = [];
  const add = (id: Id, field: string, data: RawFinding['data'], severity?: RawFinding['severity']): void => {
    out.push(finding(id, field, { form, ...data }, severity));
  };
  const evidence: string[] = [];
  let ratioEe: number | null = null;
  let parts: number[] = [];
  if (ratio !== undefined) {
    const r = parseRatio(ratio);
    for (const p of r.problems)
      add('ratio-unreadable', 'stereo.ratio', { ratio, problem: p.message, offset: p.offset + 1 });
    if (r.problems.length === 0) {
      parts = r.parts;
      const sum = parts.reduce((a, b) => a + b, 0);
      if (r.looksLikePercent && Math.abs(sum - 100) > cfg.ratioSumTolerance) {
        add(
          'ratio-parts-not-100',
          'stereo.ratio',
          { ratio, sum: fmt(sum), tolerance: cfg.ratioSumTolerance },
          'warning',
        );
      }
      const nComp = components?.length ?? 0;
      const enantiomerForm =
        form === 'racemate' || form === 'enantioenriched' || form === 'single-enantiomer';
      if (nComp > 0 && parts.length !== nComp) {
        add('ratio-components-count', 'stereo.ratio', { ratio, parts: parts.length, components: nComp });
      } else if (enantiomerForm && parts.length !== 2) {
        add('enantiomer-ratio-parts', 'stereo.ratio', { ratio, parts: parts.length });
      } else if (enantiomerForm) {
        ratioEe = eeFromRatio(parts[0], parts[1]);
        evidence.push(`ratio ${ratio} gives ee ${fmt(ratioEe ?? 0)}%`);
      }
      if (form === 'racemate' && ratioEe !== null) {
        const total = parts[0] + parts[1];
        const deviation = Math.abs((parts[0] / total) * 100 - 50);
        if (deviation > cfg.racemateRatioTolerance) {
          add('racemate-ratio-not-even', 'stereo.ratio', {
            ratio,
            deviation: fmt(deviation),
            tolerance: cfg.racemateRatioTolerance,
            ee: fmt(ratioEe),
          });
        }
      }
      if (
        form === 'diastereomer-mixture' &&
        parts.length >= 2 &&
        parts.every((p) => p === parts[0]) &&
        componentsAreDiastereomers(ctx)
      ) {
        add('diastereomer-ratio-exactly-even', 'stereo.ratio', { ratio }, 'note');
      }
    }
  }
  if (ee !== undefined) {
    if (form === 'achiral' || form === 'meso') add('ee-for-achiral-form', 'stereo.ee', { ee });
    if (ratioEe !== null && Math.abs(ratioEe - ee) > cfg.eeTolerance) {
      add('ee-disagrees-with-ratio', 'stereo.ee', {
        ee,
        ratio: ratio ?? '',
        computedEe: fmt(ratioEe),
        tolerance: cfg.eeTolerance,
      });
    }
    if (form === 'racemate' && ee > cfg.eeTolerance)
      add('racemate-ee-not-zero', 'stereo.ee', { ee, tolerance: cfg.eeTolerance });
  }
  const effectiveEe = ee ?? ratioEe;
  const source = ee !== undefined ? 'stated' : `from the ratio ${ratio ?? ''}`;
  if (effectiveEe !== null) {
    const field = ee !== undefined ? 'stereo.ee' : 'stereo.ratio';
    if (form === 'single-enantiomer' && effectiveEe < cfg.singleEnantiomerMinEe) {
      add('single-enantiomer-ee-low', field, {
        ee: fmt(effectiveEe),
        source,
        threshold: cfg.singleEnantiomerMinEe,
      });
    }
    if (form === 'enantioenriched' && effectiveEe <= cfg.eeTolerance) {
      add(
        'enantioenriched-ee-zero',
        field,
        { ee: fmt(effectiveEe), source, tolerance: cfg.eeTolerance },
        'warning',
      );
    }
    if (ee !== undefined) evidence.push(`ee ${fmt(effectiveEe)}% (stated)`);
  }
  if (out.some((x) => x.severity !== 'note')) return { findings: out };
  if (parts.length && evidence.length === 0)
    evidence.push(`ratio ${ratio} sums to ${fmt(parts.reduce((a, b) => a + b, 0))}`);
  return { findings: out, passed: `${evidence.join('; ')}; consistent with ${form}` };
}

export const ratioAndEeConsistent: CheckModule = {
  id: 'ratio-and-ee-consistent',
  defaultSeverity: 'error',
  summary: 'Component ratio and enantiomeric excess agree with each other and with the declared form.',
  explanation:
    'Enantiomeric excess is |F(+) − F(−)| for mole fractions of the two enantiomers, in percent ' +
    '100·|a − b|/(a + b) for a ratio a:b (IUPAC Gold Book, enantiomer excess). A racemate is an equimolar mixture ' +
    'of a pair of enantiomers (Gold Book, racemate), so 50:50 and ee 0. Diastereomers differ in energy and are ' +
    'normally formed in unequal amounts; enantiomers have equal energies, so achiral conditions give 50:50 — an ' +
    'exactly even diastereomer ratio deserves a question. Tolerances (ratio sum, racemate ratio, ee agreement) and ' +
    'the single-enantiomer ee threshold are registry settings (common practice, no source).',
  messages,
  run,
};
