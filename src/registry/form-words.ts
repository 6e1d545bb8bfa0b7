/**
 * Words chemists often write for a stereo form, mapped to the record format's form, so that a schema message can
 * suggest the right value ("'enantiopure' is not one of …; did you mean 'single-enantiomer'?"). Suggestions only:
 * the record must still use the exact form. Terms as in the IUPAC Gold Book (racemate, scalemic, meso) and
 * common laboratory usage (common practice, no source).
 */
import type { StereoForm } from './types.js';

const SYNONYMS: Record<string, StereoForm> = {
  enantiopure: 'single-enantiomer',
  'enantiomerically-pure': 'single-enantiomer',
  'optically-pure': 'single-enantiomer',
  homochiral: 'single-enantiomer',
  'single-isomer': 'single-enantiomer',
  racemic: 'racemate',
  rac: 'racemate',
  'racemic-mixture': 'racemate',
  dl: 'racemate',
  '±': 'racemate',
  scalemic: 'enantioenriched',
  enriched: 'enantioenriched',
  'enantiomerically-enriched': 'enantioenriched',
  'partially-resolved': 'enantioenriched',
  diastereopure: 'single-diastereomer',
  'diastereomerically-pure': 'single-diastereomer',
  'diastereomeric-mixture': 'diastereomer-mixture',
  'mixture-of-diastereomers': 'diastereomer-mixture',
  'epimeric-mixture': 'diastereomer-mixture',
  'not-chiral': 'achiral',
  undefined: 'unknown',
  unspecified: 'unknown',
  'not-determined': 'unknown',
};

/** The form a free word most likely means, or null. */
export function formSynonym(word: string): StereoForm | null {
  const key = word
    .trim()
    .toLowerCase()
    .replace(/[\s_]+/g, '-');
  return SYNONYMS[key] ?? null;
}
