/**
 * One bond from molfile numbers and codes (CTfile format specification, V2000 bond block: types 1-10, stereo
 * 1 up, 6 down, 4 either; 3 on a double bond = either/crossed). V3000 maps its CFG values to these codes.
 */
import type { Bond, ReadError } from '../types.js';
import { newBond } from './make.js';

/** Bond from molfile numbers; shared with V3000 (which passes its own stereo codes mapped to V2000 ones). */
export function makeBond(
  a: number,
  b: number,
  type: number,
  stereo: number,
  nAtoms: number,
  bondNo: number,
  line: number,
  warnings: ReadError[],
): { bond: Bond | null } | ReadError {
  if (a < 1 || a > nAtoms || b < 1 || b > nAtoms) {
    const bad = a < 1 || a > nAtoms ? a : b;
    return {
      code: 'molfile-bond-atom-missing',
      message: `bond ${bondNo} refers to atom ${bad}, but there are ${nAtoms} atoms`,
      at: { line },
    };
  }
  if (a === b)
    return {
      code: 'molfile-bond-to-itself',
      message: `bond ${bondNo} joins atom ${a} to itself`,
      at: { line },
    };
  let order: 1 | 2 | 3 = 1;
  let aromatic = false;
  switch (type) {
    case 1:
      break;
    case 2:
      order = 2;
      break;
    case 3:
      order = 3;
      break;
    case 4:
      aromatic = true;
      break;
    case 5:
    case 8:
    case 9:
      warnings.push({
        code: 'molfile-query-bond',
        message: `bond ${bondNo} has type ${type} (${type === 9 ? 'coordination' : 'query'} bond); read as a single bond`,
        at: { line },
      });
      break;
    case 6:
    case 7:
      aromatic = true;
      warnings.push({
        code: 'molfile-query-bond',
        message: `bond ${bondNo} has query type ${type}; read as aromatic`,
        at: { line },
      });
      break;
    case 10:
      warnings.push({
        code: 'molfile-hydrogen-bond',
        message: `bond ${bondNo} is a hydrogen bond (type 10); left out`,
        at: { line },
      });
      return { bond: null };
    default:
      return {
        code: 'molfile-bad-bond-type',
        message: `bond ${bondNo} has type ${type}; the format defines types 1-10`,
        at: { line },
      };
  }
  let wedge: Bond['wedge'] = null;
  if (stereo !== 0) {
    if (order === 2) {
      if (stereo === 3) wedge = 'either';
      else
        warnings.push({
          code: 'molfile-bad-bond-stereo',
          message: `double bond ${bondNo} has stereo code ${stereo}; only 0 and 3 apply to double bonds`,
          at: { line },
        });
    } else if (order === 1) {
      if (stereo === 1) wedge = 'up';
      else if (stereo === 6) wedge = 'down';
      else if (stereo === 4) wedge = 'either';
      else
        warnings.push({
          code: 'molfile-bad-bond-stereo',
          message: `single bond ${bondNo} has stereo code ${stereo}; only 0, 1, 4 and 6 apply`,
          at: { line },
        });
    } else {
      warnings.push({
        code: 'molfile-bad-bond-stereo',
        message: `bond ${bondNo} of order ${order} carries a stereo mark; ignored`,
        at: { line },
      });
    }
  }
  return { bond: newBond(a - 1, b - 1, order, aromatic, wedge) };
}
