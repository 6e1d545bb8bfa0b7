/**
 * The mixture part of form-matches-structure: a diastereomer mixture's components must be pairwise
 * diastereomers with the parent's constitution; a racemate's components, when listed, must be enantiomers.
 */
import type { StructureFacts } from '../chem/facts.js';
import type { CheckContext, RawFinding } from './types.js';
import { finding } from './words.js';

export const mixtureMessages = {
  'mixture-needs-components':
    'Declared diastereomer-mixture with {count:component|components} under stereo.components; a mixture needs two or ' +
    'more, each drawn with its configuration. List the components.',
  'mixture-components-identical':
    'Components {a} and {b} are the same stereoisomer ({explanation}). A diastereomer mixture lists each ' +
    'diastereomer once; remove the duplicate or correct its configuration.',
  'mixture-components-enantiomers':
    'Components {a} and {b} are enantiomers, not diastereomers ({explanation}). A mixture of two enantiomers is ' +
    'a racemate (1:1) or an enantioenriched sample; declare that form, or correct a configuration.',
  'mixture-components-unrelated':
    'Components {a} and {b} are {relation}, not diastereomers of each other ({explanation}). The components of ' +
    'a diastereomer mixture differ only in configuration, and each is fully defined.',
  'mixture-component-constitution':
    'Component {a} ({componentFormula}) does not have the constitution of the parent structure ' +
    '({parentFormula}). Each component must be a stereoisomer of the registered structure.',
  'racemate-components-not-enantiomers':
    'The racemate lists components {a} and {b}, which are {relation}, not enantiomers ({explanation}). A racemate ' +
    'is a 1:1 mixture of two enantiomers; correct the components or the form.',
  'racemate-components-count':
    'The racemate lists {count:component|components}; a racemate consists of exactly two enantiomers. List both, or none.',
} as const;

export function mixtureFindings(ctx: CheckContext, parent: StructureFacts): RawFinding[] {
  const record = ctx.record;
  if (!record) return [];
  const form = record.stereo.form;
  const comps = record.stereo.components ?? [];
  const out: RawFinding[] = [];
  const field = 'stereo.components';
  if (form === 'diastereomer-mixture' && comps.length < 2) {
    out.push(finding('mixture-needs-components', field, { form, count: comps.length }));
    return out;
  }
  if (form === 'racemate' && comps.length > 0 && comps.length !== 2) {
    out.push(finding('racemate-components-count', field, { form, count: comps.length }, 'warning'));
    return out;
  }
  if (form !== 'diastereomer-mixture' && form !== 'racemate') return out;
  if (comps.length < 2) return out;
  const read = ctx.components;
  if (form === 'diastereomer-mixture') {
    read.forEach((c, i) => {
      if (c.facts && c.facts.constitutionKey !== parent.constitutionKey) {
        out.push(
          finding('mixture-component-constitution', `stereo.components.${i}`, {
            a: i + 1,
            componentFormula: c.facts.formula,
            parentFormula: parent.formula,
          }),
        );
      }
    });
  }
  for (let i = 0; i < read.length; i++) {
    for (let j = i + 1; j < read.length; j++) {
      const a = read[i].structure;
      const b = read[j].structure;
      if (!a || !b) continue;
      const rel = ctx.engine.relate(a, b);
      const data = { form, a: i + 1, b: j + 1, relation: rel.relation, explanation: rel.explanation };
      const at = `stereo.components.${j}`;
      if (form === 'racemate') {
        if (rel.relation !== 'enantiomers')
          out.push(finding('racemate-components-not-enantiomers', at, data));
        continue;
      }
      if (rel.relation === 'diastereomers') continue;
      if (rel.relation === 'identical') out.push(finding('mixture-components-identical', at, data));
      else if (rel.relation === 'enantiomers') out.push(finding('mixture-components-enantiomers', at, data));
      else out.push(finding('mixture-components-unrelated', at, data));
    }
  }
  return out;
}
