/**
 * Message templates of origin-supports-claim, by stable message id. Each says what was declared, what the origin
 * implies and why (the chemistry), and what the chemist can do.
 */
export const originMessages = {
  'input-not-found':
    "origin.from names '{entry}', which is not a registered id{suggestion} and not a SMILES stereogate can read " +
    'either ({detail}). Register the input first, correct the id, or give the input as SMILES.',
  'input-unreadable':
    "origin.from entry {position}, '{entry}', is neither a registered id nor a readable SMILES: {detail}. Correct " +
    "it, or give the input's registered id.",
  'input-without-structure':
    'origin.from names {entry}, whose structure cannot be read ({detail}); the origin cannot be judged until it can. ' +
    "Fix {entry}'s structure.",
  'origin-cycle':
    'The origins form a cycle: {cycle} (each made from the next). A compound cannot be made from itself, even ' +
    'through intermediates: one of these origin.from lists names the wrong id.',
  'no-source-of-bias':
    'Declared {claim}, but nothing in its origin can make one enantiomer in excess: {inputs}, and origin.control ' +
    'is none. With nothing chiral present, the pathways to the two enantiomers are mirror images: their ' +
    'transition states are enantiomeric, equal in energy, so both enantiomers form at the same rate. Expected: ' +
    '{expected}. Declare racemate (with rac- descriptors), or name the source of the bias in origin.control.',
  'desymmetrised-without-control':
    'Declared {claim}, but it is made from {inputs} by a step that tells apart two mirror-image (enantiotopic) ' +
    'groups or faces, and origin.control is none. Enantiotopic groups react at equal rates unless something chiral ' +
    '(an enzyme, a chiral catalyst or reagent) tells them apart, so each enantiomer forms as often as the other. ' +
    'Expected: {expected}. Declare racemate, or name the enzyme or chiral catalyst in origin.control.',
  'control-not-stated':
    'Declared {claim}; the inputs hold no source of enantiomeric bias ({inputs}), so the claim rests on what else ' +
    'was present, and origin.control is {control}. Not checked: state origin.control (none, chiral-catalyst, ' +
    'biocatalyst, resolution, …).',
  'input-stereo-unknown':
    'Not checked whether the origin can give {claim}: {why}. Register the input with its stereo form, or draw ' +
    'its configuration (a racemic SMILES can say so with an AND group, e.g. |&1:1|).',
  'carried-enantiomer':
    '{units} {verb} carried from {input} with no bond at {pronoun} made or broken, but drawn with the ' +
    "mirror-image arrangement of {input}'s (compared through the mapped neighbours, not the CIP labels, which " +
    'can change when priorities change): the drawing starts from the enantiomer of {input}. A drawn enantiomer ' +
    'is the usual registration slip: correct the drawing, or the input.',
  'carried-epimer':
    '{inverted} {verb} carried from {input} with no bond at {pronoun} made or broken, but drawn with the opposite ' +
    'spatial arrangement, while {kept} keep{keepS} the arrangement of {input}: the drawing is an epimer ' +
    '(diastereomer) of what {input} gives. Correct the drawing at {inverted}, or the input.',
  'carried-relative-differs':
    '{input} is racemic, so either enantiomer may be drawn, but its relative configuration survives a reaction ' +
    'that makes or breaks no bond at its stereo units: {inverted} and {kept} come from {input} unchanged, yet ' +
    'only {inverted} {verb} drawn inverted. The drawing is a diastereomer of what {input} gives; correct it.',
  'carried-unit-open':
    '{unit} comes from {input} with no bond at it changed, but {side} leaves its configuration undefined, so the ' +
    'two cannot be compared. Draw the configuration on both.',
  'racemate-from-enriched-input':
    'Declared {claim}, but {unit} comes from {input} ({why}) with no bond at it made or broken, so it keeps its ' +
    'configuration and the product carries the same excess of one enantiomer. Expected: {expected}. If that ' +
    'centre racemised (an enolisable α-centre can), record the evidence and accept this finding; otherwise ' +
    'declare the form the carried centre gives.',
  'ee-above-input':
    'Declared {productEe} ({source}), but the only source of enantiomeric excess is {unit} carried from {input}, ' +
    'ee {inputEe}%: a reaction that makes or breaks no bond at that centre cannot raise its ee, and ' +
    'origin.control is {control}. If the product was purified to higher ee (recrystallisation, chiral ' +
    'chromatography), set origin.control to enrichment or chiral-separation; otherwise correct the ee.',
  'ee-input-unknown':
    'Declared {claim}; its enantiomeric excess comes from {unit} carried from {input}, which states no ee, so ' +
    "whether the product's purity exceeds the input's is not checked. Record the ee of {input}.",
  'mixture-component-differs':
    'Component {component} of the diastereomer mixture shows {unit} inverted, yet {unit} comes from {input} with no ' +
    'bond at it changed: every diastereomer made from {input} keeps that configuration. The components should ' +
    'differ only at the units the reaction formed ({formed}). Correct the component.',
  'diastereomers-one-to-one':
    'The diastereomers are reported at {ratio}. They differ at {formed}, formed next to {carried} carried from ' +
    '{input}: the transition states leading to them are diastereomeric, differ in energy, and give unequal ' +
    "amounts (Cram's rule is the textbook case). Was {ratio} measured (NMR integration, HPLC)? Record the " +
    'measured ratio.',
  'diastereomer-ratio-not-stated':
    'One diastereomer is declared, from a reaction that forms {formed} while {carried} comes from {input}. ' +
    'Diastereomers form in unequal amounts, so one major product is what the origin predicts; the diastereomer ' +
    'ratio of the crude product or the evidence of purity (NMR, HPLC) is worth stating in stereo.ratio or ' +
    'stereo.evidence.',
  'units-unmapped':
    'Not checked at {units}: {reason}. The claims about {pronoun} are not judged against the origin.',
} as const;

export type OriginMessageId = keyof typeof originMessages;
