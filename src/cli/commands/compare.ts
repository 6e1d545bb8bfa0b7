/** `stereogate compare <A> <B> [--format json|text]` */
import { CAUTION } from '../../audit/caution.js';
import { relate } from '../../chem/index.js';
import { parseCommandArgs } from '../args.js';
import { EXIT_OK, EXIT_USAGE, type Command } from '../command.js';
import { loadStructure } from '../input.js';
import { compareText } from '../format-compare.js';

export const compareCommand: Command = {
  name: 'compare',
  summary:
    'how two structures are related: identical, enantiomers, diastereomers, constitutional isomers, ...',
  usage: [
    'Usage: stereogate compare <A> <B> [--format json|text]',
    '',
    '  <A> <B>              SMILES strings or structure files (see `stereogate describe --help`)',
    '  --format json|text   output format (default text)',
    '',
    'Relations: identical, enantiomers, diastereomers (epimers flagged), constitutional-isomers,',
    'different-compounds, same-constitution (undefined stereo leaves it open). Salts: the parent components',
    'are related; other components are listed apart.',
    '',
    'Exit codes: 0 compared, 2 usage error or a structure that cannot be read.',
  ].join('\n'),
  run(args, io) {
    const { values, positionals } = parseCommandArgs(
      args,
      { format: { type: 'string', choices: ['json', 'text'], default: 'text' } },
      { min: 2, max: 2, names: 'two structures (A and B)' },
    );
    const a = loadStructure(positionals[0], io);
    const b = loadStructure(positionals[1], io);
    for (const [name, r] of [
      ['A', a],
      ['B', b],
    ] as const) {
      if (!r.ok) {
        io.err(`stereogate compare: structure ${name}: ${r.message}`);
        return EXIT_USAGE;
      }
    }
    if (!a.ok || !b.ok) return EXIT_USAGE;
    const facts = relate(a.structure, b.structure);
    // The caution once per report: after the text, or on standard error beside JSON (stdout stays parseable).
    if (values.format === 'json') {
      io.out(JSON.stringify(facts, null, 2));
      io.err(CAUTION);
    } else io.out(`${compareText(facts)}\n\n${CAUTION}`);
    return EXIT_OK;
  },
};
