/** `stereogate describe <SMILES|file> [--format json|text] [--list] [--max N]` */
import { CAUTION } from '../../audit/caution.js';
import { describe } from '../../chem/index.js';
import { parseCommandArgs } from '../args.js';
import { EXIT_OK, EXIT_USAGE, UsageError, type Command } from '../command.js';
import { loadStructure } from '../input.js';
import { describeText } from '../format-describe.js';

export const describeCommand: Command = {
  name: 'describe',
  summary: 'stereo facts of one structure: stereocentres, stereo bonds, chirality, meso, stereoisomer count',
  usage: [
    'Usage: stereogate describe <SMILES | file | -> [--format json|text] [--list] [--max N]',
    '',
    '  <SMILES | file | ->  a SMILES string, a molfile / SD file (first record) / SMILES file, or - for stdin',
    '  --format json|text   output format (default text)',
    '  --list               also list the stereoisomers of the constitution (SMILES and CIP labels)',
    '  --max N              list at most N stereoisomers (default 64)',
    '',
    'Atoms are numbered 1, 2, ... in input order; explicit hydrogen atoms count, [C@H]-style hydrogens do not.',
    '',
    'Exit codes: 0 described, 2 usage error or a structure that cannot be read.',
  ].join('\n'),
  run(args, io) {
    const { values, positionals } = parseCommandArgs(
      args,
      {
        format: { type: 'string', choices: ['json', 'text'], default: 'text' },
        list: { type: 'boolean' },
        max: { type: 'string' },
      },
      { min: 1, max: 1, names: 'structure (SMILES or file)' },
    );
    const max = values.max === undefined ? 64 : Number(values.max);
    if (!Number.isInteger(max) || max < 1) throw new UsageError('--max must be a positive whole number');
    const loaded = loadStructure(positionals[0], io);
    if (!loaded.ok) {
      io.err(`stereogate describe: ${loaded.message}`);
      return EXIT_USAGE;
    }
    const facts = describe(loaded.structure, { listIsomers: values.list === true, maxIsomers: max });
    for (const w of loaded.warnings) facts.remarks.unshift(`reading: ${w.message}`);
    // The caution once per report: after the text, or on standard error beside JSON (stdout stays parseable).
    if (values.format === 'json') {
      io.out(JSON.stringify(facts, null, 2));
      io.err(CAUTION);
    } else
      io.out(
        `${describeText(facts, loaded.source === 'SMILES argument' ? positionals[0] : loaded.source)}\n\n${CAUTION}`,
      );
    return EXIT_OK;
  },
};
