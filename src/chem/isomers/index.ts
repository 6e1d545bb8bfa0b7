/** Stereoisomers of a constitution: counted (Burnside over the unit group) and enumerated. The one public entry of isomers/. */
export { countStereoisomers, countValue, enumerateStereoisomers, exactCount } from './count.js';
