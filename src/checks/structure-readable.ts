/**
 * Check: the record's structures can be read, and a molfile path stays inside the registry.
 * The loader resolves molfile paths safely and reports what went wrong; the reader reports where a SMILES or
 * molfile is broken. This check turns both into findings on the record field they concern.
 */
import { posix } from 'node:path';
import type { CheckContext, CheckModule, CheckOutcome, RawFinding, ReadStructure } from './types.js';
import { finding, plural } from './words.js';
import { NITROGEN_CHECK_ID } from './nitrogen-inversion.js';

const messages = {
  'structure-unreadable':
    'The structure in {field} could not be read: {error}{where}. Nothing about its stereochemistry can be checked. ' +
    'Correct the SMILES or molfile (check ring-closure digits, brackets and the counts line) and resubmit.',
  'structure-over-limit':
    'The structure in {field} was not analysed: {error}. The size limits keep every record within the time ' +
    'limit; split a mixture into its records, or leave out repeated salt or solvent parts, and resubmit.',
  'component-unreadable':
    'Component {index} ({field}) could not be read: {error}{where}. The mixture cannot be checked against it. ' +
    'Correct that structure.',
  'structure-source-refused':
    'The structure file for {field} was not read: {error}. Molfiles must be given as a path relative to the record ' +
    'file that stays inside the registry (no "..", no absolute path, no link out). Move the file next to the record.',
  'molfile-path-outside':
    "The molfile path '{path}' in {field} resolves to '{resolved}', outside the registry folder. Give a path " +
    'relative to the record file that stays inside the registry.',
  'reader-remark': 'Reading the structure in {field} gave a remark: {remark}. Check the drawing.',
  'no-structure':
    'The record gives no structure ({field}). Add exactly one of structure.smiles or structure.molfile.',
} as const;

type Id = keyof typeof messages;

/** Reader codes of the size caps (src/chem/read/limits.ts): input over a cap, not a broken drawing. */
const OVER_LIMIT = new Set(['smiles-too-long', 'molfile-too-long', 'too-many-atoms', 'too-many-components']);

function where(r: ReadStructure): string {
  const e = r.error;
  if (!e) return '';
  if (e.line !== null) return ` (line ${e.line} of the molfile)`;
  if (e.offset !== null) return ` (at character ${e.offset + 1} of the SMILES)`;
  return '';
}

/** Field of the main structure as written in the record. */
function mainField(ctx: CheckContext): string {
  return ctx.record?.structure.molfile !== undefined ? 'structure.molfile' : 'structure.smiles';
}

function componentField(ctx: CheckContext, i: number): string {
  const c = ctx.record?.stereo.components?.[i];
  return `stereo.components.${i}.${c?.molfile !== undefined ? 'molfile' : 'smiles'}`;
}

/** A molfile path, as written relative to the record file, that climbs out of the registry root. */
function escapingPath(recordFile: string, path: string): string | null {
  if (posix.isAbsolute(path) || /^[a-zA-Z]:[\\/]/.test(path) || path.startsWith('\\')) return path;
  const resolved = posix.normalize(posix.join(posix.dirname(recordFile), path.replace(/\\/g, '/')));
  return resolved === '..' || resolved.startsWith('../') ? resolved : null;
}

function run(ctx: CheckContext): CheckOutcome {
  const findings: RawFinding[] = [];
  const add = (id: Id, field: string | null, data: RawFinding['data']): void => {
    findings.push(finding(id, field, data));
  };
  const sources = ctx.loaded.sources;
  if (sources?.main?.error) {
    add('structure-source-refused', mainField(ctx), { field: mainField(ctx), error: sources.main.error });
  }
  sources?.components.forEach((s, i) => {
    if (s.error)
      add('structure-source-refused', componentField(ctx, i), {
        field: componentField(ctx, i),
        error: s.error,
      });
  });
  // Defence in depth for records that did not come through the loader's resolver.
  const paths: { field: string; path: string | undefined }[] = [
    { field: 'structure.molfile', path: ctx.record?.structure.molfile },
    ...(ctx.record?.stereo.components ?? []).map((c, i) => ({
      field: `stereo.components.${i}.molfile`,
      path: c.molfile,
    })),
  ];
  for (const p of paths) {
    if (p.path === undefined || findings.some((f) => f.field === p.field)) continue;
    const out = escapingPath(ctx.loaded.file, p.path);
    if (out !== null) add('molfile-path-outside', p.field, { field: p.field, path: p.path, resolved: out });
  }

  const field = mainField(ctx);
  if (ctx.record && ctx.record.structure.smiles === undefined && ctx.record.structure.molfile === undefined) {
    add('no-structure', 'structure', { field: 'structure' });
  } else if (ctx.main.error && !findings.some((f) => f.field === field)) {
    const over = OVER_LIMIT.has(ctx.main.error.code ?? '');
    add(over ? 'structure-over-limit' : 'structure-unreadable', field, {
      field,
      error: ctx.main.error.message,
      where: where(ctx.main),
      errorLine: ctx.main.error.line,
      errorOffset: ctx.main.error.offset,
    });
  }
  ctx.components.forEach((c, i) => {
    const cf = componentField(ctx, i);
    if (c.error && !findings.some((f) => f.field === cf)) {
      add('component-unreadable', cf, {
        index: i + 1,
        field: cf,
        error: c.error.message,
        where: where(c),
        errorLine: c.error.line,
        errorOffset: c.error.offset,
      });
    }
  });
  // Remarks about configurations drawn on ordinary amine nitrogens are left to nitrogen-inversion, which
  // reports every such nitrogen (as the error, or as a note) unless the registry switched it off.
  const nitrogenCheckOn = ctx.config.severities[NITROGEN_CHECK_ID] !== 'off';
  let leftToNitrogen = 0;
  // Several copies of the parent beside a counter-ion is a salt's stoichiometry (bis(amphetamine) sulfate, 2:1):
  // said in the evidence. Copies with nothing else (CCO.CCO) stay a note: that drawing is worth a look.
  const salt = (ctx.main.facts?.components ?? []).some((c) => c.role === 'other');
  const saltRemarks: string[] = [];
  for (const remark of ctx.main.facts?.remarks ?? []) {
    if (salt && /identical copies of the parent/.test(remark)) {
      saltRemarks.push(remark.replace(/:.*$/, ' (a salt)'));
      continue;
    }
    if (
      nitrogenCheckOn &&
      (ctx.main.facts?.invertibleNitrogens.length ?? 0) > 0 &&
      /amine nitrogen/.test(remark)
    ) {
      leftToNitrogen++;
      continue;
    }
    findings.push(finding('reader-remark', field, { field, remark }, 'note'));
  }
  if (findings.some((f) => f.severity !== 'note')) return { findings };
  const facts = ctx.main.facts;
  const atoms = ctx.main.structure?.atoms.length;
  const what = [atoms !== undefined ? plural(atoms, 'atom') : null, facts?.formula || null]
    .filter(Boolean)
    .join(', ');
  const comps = ctx.components.length ? `; ${plural(ctx.components.length, 'component structure')} read` : '';
  const nitrogen = leftToNitrogen
    ? `; ${plural(leftToNitrogen, 'remark')} on amine nitrogens left to nitrogen-inversion`
    : '';
  const copies = saltRemarks.length ? `; ${saltRemarks.join('; ')}` : '';
  return { findings, passed: `structure read${what ? ` (${what})` : ''}${comps}${copies}${nitrogen}` };
}

export const structureReadable: CheckModule = {
  id: 'structure-readable',
  defaultSeverity: 'error',
  summary: 'The structure (SMILES or molfile) can be read, and a molfile path stays inside the registry.',
  explanation:
    'Every other check works on the structure, so a structure that cannot be read leaves the stereo claim ' +
    'unchecked. SMILES are read by the OpenSMILES specification, molfiles by the CTfile format specification ' +
    '(V2000 and V3000). A molfile is named by a path relative to the record file; a path that leaves the ' +
    'registry (.., an absolute path, or a symbolic link out) is refused, so that a pull request cannot make the ' +
    'audit read files elsewhere on the machine.',
  messages,
  run,
};
