/**
 * The list of checks, in the order they run and appear in the checklist. Adding a check means adding a module
 * file and one line here; the waiver check stays last because it reviews the findings of all the others.
 */
import type { CheckModule } from './types.js';
import { structureReadable } from './structure-readable.js';
import { formMatchesStructure } from './form-matches-structure.js';
import { enhancedStereoMatchesForm } from './enhanced-stereo-matches-form.js';
import { descriptorsMatchStructure } from './descriptors-match-structure.js';
import { ratioAndEeConsistent } from './ratio-and-ee-consistent.js';
import { rotationConsistent } from './rotation-consistent.js';
import { nitrogenInversion } from './nitrogen-inversion.js';
import { consistentWithRegistry } from './consistent-with-registry.js';
import { originSupportsClaim } from './origin-supports-claim.js';
import { waiverReview } from './waivers.js';

export const CHECKS: CheckModule[] = [
  structureReadable,
  formMatchesStructure,
  enhancedStereoMatchesForm,
  descriptorsMatchStructure,
  ratioAndEeConsistent,
  rotationConsistent,
  nitrogenInversion,
  consistentWithRegistry,
  originSupportsClaim,
  waiverReview,
];

export { reviewWaivers, WAIVER_CHECK_ID } from './waivers.js';
