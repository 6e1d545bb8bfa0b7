/**
 * Hand-made engine facts and check contexts for the check tests, so each check can be tested on exactly the
 * facts it reads. Tests that go through real structures use real.ts instead.
 */
import type { RelationFacts, Relation, StereoUnitFact, StructureFacts } from '../../src/chem/facts.js';
import type { Structure } from '../../src/chem/types.js';
import type {
  CheckContext,
  CheckModule,
  CheckOutcome,
  ReadStructure,
  RegistryEntry,
} from '../../src/checks/types.js';
import type { CompoundRecord, LoadedRecord } from '../../src/registry/types.js';
import type { Finding } from '../../src/audit/types.js';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';

export function unit(p: Partial<StereoUnitFact> & { atoms: number[] }): StereoUnitFact {
  return {
    kind: 'tetrahedral',
    element: 'C',
    defined: true,
    label: null,
    pseudoasymmetric: false,
    locants: p.atoms.map(() => null),
    group: null,
    equivalenceClass: 0,
    classKey: `${p.atoms.join(',')}${p.kind ?? 'tetrahedral'}`,
    component: 0,
    ...p,
  };
}

/** A centre at `atom` with `label`; `map` gives it an atom-map locant. */
export function centre(
  atom: number,
  label: StereoUnitFact['label'],
  map: number | null = null,
): StereoUnitFact {
  return unit({ atoms: [atom], label, defined: label !== null, locants: [map] });
}

export function facts(p: Partial<StructureFacts> = {}): StructureFacts {
  const units = p.units ?? [];
  const f: StructureFacts = {
    stereocenters: units
      .filter((u) => u.kind === 'tetrahedral')
      .map((u) => ({ atom: u.atoms[0], label: u.label, element: u.element, defined: u.defined })),
    stereobonds: units
      .filter((u) => u.kind !== 'tetrahedral')
      .map((u) => ({
        atoms: [u.atoms[0], u.atoms[1]] as [number, number],
        label: u.label,
        kind: u.kind,
        defined: u.defined,
      })),
    units,
    chiral: false,
    meso: false,
    undefined: units.filter((u) => !u.defined).length,
    stereoisomers: { total: 1, chiral: 0, achiral: 1, pairs: 0, meso: 0, units: units.length },
    mirror: {
      chiral: false,
      fixedAtoms: [],
      fixedBonds: [],
      explanation: 'superimposable on its mirror image',
    },
    enhanced: { groups: [], meaning: units.some((u) => u.defined) ? 'absolute' : 'none' },
    invertibleNitrogens: [],
    components: [],
    constitutionKey: 'K1',
    formula: 'C4H10O',
    remarks: [],
    ...p,
  };
  if (p.undefined === undefined) f.undefined = units.filter((u) => !u.defined).length;
  return f;
}

/** A chiral structure with the given defined units (one enantiomer pair per 2^n isomers). */
export function chiralFacts(units: StereoUnitFact[], p: Partial<StructureFacts> = {}): StructureFacts {
  const n = units.length;
  return facts({
    units,
    chiral: true,
    meso: false,
    stereoisomers: { total: 2 ** n, chiral: 2 ** n, achiral: 0, pairs: 2 ** (n - 1), meso: 0, units: n },
    mirror: {
      chiral: true,
      fixedAtoms: [],
      fixedBonds: [],
      explanation: 'not superimposable on its mirror image',
    },
    ...p,
  });
}

export function structure(tag: string, chiralFlag: boolean | null = null): Structure {
  return {
    atoms: [],
    bonds: [],
    stereo: [],
    groups: [],
    chiralFlag,
    title: tag,
    properties: {},
    dimension: 0,
  };
}

export function read(
  f: StructureFacts | null,
  tag = 'main',
  chiralFlag: boolean | null = null,
): ReadStructure {
  return { structure: f ? structure(tag, chiralFlag) : null, facts: f, error: null };
}

export function failedRead(message: string, line: number | null, offset: number | null): ReadStructure {
  return { structure: null, facts: null, error: { message, line, offset } };
}

export function record(
  stereo: Partial<CompoundRecord['stereo']> = {},
  p: Partial<CompoundRecord> = {},
): CompoundRecord {
  return { id: 'LX-00001', structure: { smiles: 'CC' }, stereo: { form: 'achiral', ...stereo }, ...p };
}

export function loaded(r: CompoundRecord | null, file = 'compounds/LX-00001.yml'): LoadedRecord {
  return {
    file,
    id: r?.id ?? null,
    record: r,
    positions: { get: () => undefined },
    problems: [],
    origin: { kind: 'file' },
  };
}

/** Relations between structures by their tags: relations['a|b'] (order-free). Default 'different-compounds'. */
export function fakeEngine(relations: Record<string, Relation> = {}): CheckContext['engine'] {
  return {
    relate(a: Structure, b: Structure): RelationFacts {
      const rel =
        relations[`${a.title}|${b.title}`] ?? relations[`${b.title}|${a.title}`] ?? 'different-compounds';
      return {
        relation: rel,
        differingUnits: [],
        relabelledUnits: [],
        epimers: false,
        otherComponents: { onlyInA: [], onlyInB: [] },
        formDifferences: [],
        explanation: `${a.title} and ${b.title} are ${rel}`,
      };
    },
  };
}

export interface CtxOptions {
  record?: CompoundRecord | null;
  main?: ReadStructure;
  components?: ReadStructure[];
  relations?: Record<string, Relation>;
  config?: Partial<CheckContext['config']>;
  findings?: Finding[];
  entries?: RegistryEntry[];
  loaded?: LoadedRecord;
  file?: string;
}

export function ctx(o: CtxOptions = {}): CheckContext {
  const r = o.record === undefined ? record() : o.record;
  const entries = o.entries ?? [];
  return {
    loaded: o.loaded ?? loaded(r, o.file),
    record: r,
    main: o.main ?? read(facts()),
    components: o.components ?? [],
    registry: { entries },
    config: { ...DEFAULT_CONFIG, ...o.config },
    engine: fakeEngine(o.relations),
    findings: o.findings,
  };
}

export function entry(
  r: CompoundRecord,
  main: ReadStructure,
  file: string,
  underReview = false,
): RegistryEntry {
  return { id: r.id, file, record: r, main, underReview };
}

/** Message ids of a check's outcome, sorted. */
export function ids(o: CheckOutcome): string[] {
  return o.findings.map((f) => f.messageId).sort();
}

/** Every message id a check reports must have a template, and every {placeholder} must be filled. */
export function assertRenderable(check: CheckModule, o: CheckOutcome): void {
  for (const f of o.findings) {
    const t = check.messages[f.messageId];
    if (t === undefined) throw new Error(`${check.id}: no template for ${f.messageId}`);
    for (const m of t.matchAll(/\{(\w+)\}/g)) {
      if (!(m[1] in f.data)) throw new Error(`${check.id}/${f.messageId}: placeholder {${m[1]}} not in data`);
    }
  }
}

/** Runs a check and asserts its findings render (so every test also checks the templates). */
export function runCheck(check: CheckModule, c: CheckContext): CheckOutcome {
  const o = check.run(c);
  assertRenderable(check, o);
  return o;
}
