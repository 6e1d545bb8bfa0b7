/** describe facts -> plain text for a chemist. */
import { countValue, type StructureFacts, type StereoUnitFact } from '../chem/index.js';

const yesNo = (v: boolean | null, open = 'open (undefined stereo)'): string =>
  v === null ? open : v ? 'yes' : 'no';

function unitLine(u: StereoUnitFact): string {
  const where = u.atoms.length === 1 ? `${u.element}${u.atoms[0]}` : `${u.kind} ${u.atoms.join('–')}`;
  const conf = u.defined
    ? (u.label ?? 'defined (no CIP label)')
    : u.formatCannotState
      ? `open (${u.openBecause ?? 'the input cannot state it'})`
      : 'undefined';
  const extra: string[] = [];
  if (u.pseudoasymmetric) extra.push('pseudoasymmetric');
  if (u.group)
    extra.push(
      u.group.type === 'abs' ? 'absolute' : `${u.group.type === 'and' ? 'AND' : 'OR'} group ${u.group.id}`,
    );
  return `  ${where.padEnd(18)} ${conf}${extra.length ? `  (${extra.join(', ')})` : ''}`;
}

export function describeText(f: StructureFacts, what: string): string {
  const out: string[] = [];
  out.push(`Structure: ${what}`);
  out.push(`Formula: ${f.formula}${f.components.length > 1 ? ` (${f.components.length} components)` : ''}`);
  const centres = f.units.filter((u) => u.kind === 'tetrahedral');
  const bonds = f.units.filter((u) => u.kind !== 'tetrahedral');
  const nDef = (us: StereoUnitFact[]): number => us.filter((u) => u.defined).length;
  out.push(
    `Stereocentres: ${centres.length === 0 ? 'none' : `${centres.length} (${nDef(centres)} defined)`}`,
  );
  for (const u of centres) out.push(unitLine(u));
  out.push(
    `Stereogenic double bonds and axes: ${bonds.length === 0 ? 'none' : `${bonds.length} (${nDef(bonds)} defined)`}`,
  );
  for (const u of bonds) out.push(unitLine(u));
  // Open without undefined units: an impossible drawing or unmodelled planar chirality (see the remarks).
  const open = f.undefined > 0 ? undefined : 'open (see the remarks)';
  out.push(
    `Chiral: ${yesNo(f.chiral, open)} — ${f.mirror.explanation.replace(/^(achiral|chiral|open): /, '')}`,
  );
  out.push(`Meso: ${yesNo(f.meso, open)}`);
  if (f.undefined > 0) out.push(`Undefined stereo units: ${f.undefined}`);
  const c = f.stereoisomers;
  out.push(
    `Stereoisomers of this constitution: ${c.total} (${c.chiral} chiral = ${c.pairs} enantiomer pair${c.pairs === 1 ? '' : 's'}, ` +
      `${c.achiral} achiral${countValue(c.meso) > 0n ? `, of which ${c.meso} meso` : ''})`,
  );
  if (f.enhanced.meaning !== 'none' && (f.enhanced.groups.length > 0 || f.enhanced.meaning !== 'absolute')) {
    out.push(`Enhanced stereo: the drawing stands for ${enhancedWords(f.enhanced.meaning)}`);
  }
  for (const n of f.invertibleNitrogens)
    out.push(`Note: N${n.atom} is an invertible amine nitrogen, not a stereocentre`);
  if (f.components.length > 1) {
    out.push('Components:');
    for (const k of f.components)
      out.push(
        `  ${k.role === 'parent' ? 'parent' : 'other '}  ${k.formula.padEnd(14)} ${k.smiles}${k.copies ? `  (one of ${k.copies} identical copies)` : ''}`,
      );
  }
  if (f.stereoisomerList) {
    out.push(
      `Stereoisomers${BigInt(f.stereoisomerList.length) < countValue(c.total) ? ` (first ${f.stereoisomerList.length})` : ''}:`,
    );
    for (const e of f.stereoisomerList) {
      const labels = e.labels.map((l) => `${l.atoms.join('/')}${l.label ?? '?'}`).join(' ') || '-';
      out.push(
        `  ${e.smiles}   ${labels}   ${e.chiral ? 'chiral' : 'achiral'}${e.isInput ? '   <- input' : ''}`,
      );
    }
  }
  for (const r of f.remarks) out.push(`Remark: ${r}`);
  out.push('Atoms are numbered in input order (explicit hydrogen atoms count).');
  return out.join('\n');
}

function enhancedWords(m: StructureFacts['enhanced']['meaning']): string {
  switch (m) {
    case 'absolute':
      return 'one stereoisomer, as drawn (absolute configuration)';
    case 'racemic':
      return 'the drawn stereoisomer and its mirror image together (racemate)';
    case 'relative':
      return 'the drawn stereoisomer or its mirror image, not known which (relative configuration)';
    case 'mixture':
      return 'a mixture of several stereoisomers (more than one AND group)';
    case 'mixed':
      return 'a combination of absolute, AND and OR parts';
    default:
      return 'no defined stereo';
  }
}
