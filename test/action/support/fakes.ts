/** A fake engine (hand-built audit results) and a runner that records what the action told it. */
import type { Engine, Runner } from '../../../src/action/ports.js';
import type { Annotation } from '../../../src/github/annotations.js';
import type { AuditResult } from '../../../src/audit/types.js';

export interface FakeEngine extends Engine {
  calls: { root: string; paths?: string[]; configFile?: string }[];
}

export function fakeEngine(result: AuditResult): FakeEngine {
  const calls: FakeEngine['calls'] = [];
  return {
    calls,
    async audit(options) {
      calls.push(options);
      return options.paths !== undefined && options.paths.length === 0
        ? { ...result, records: [], summary: { records: 0, errors: 0, warnings: 0, notes: 0, waived: 0 } }
        : result;
    },
    async recordDirs() {
      return ['compounds'];
    },
    renderMarkdown(r, options) {
      return `<!-- stereogate-checklist -->\n${r.summary.records} records, ${r.summary.errors} errors (max ${options.maxChars ?? 'none'}, details ${options.detailsUrl ?? 'none'})`;
    },
    renderSarif(r, uriPrefix) {
      return { version: '2.1.0', uriPrefix, results: r.summary.errors };
    },
  };
}

export interface RecordingRunner extends Runner {
  infos: string[];
  warnings: string[];
  annotations: Annotation[];
  summaries: string[];
  outputs: Record<string, string | number>;
}

export function recordingRunner(): RecordingRunner {
  const runner: RecordingRunner = {
    infos: [],
    warnings: [],
    annotations: [],
    summaries: [],
    outputs: {},
    info: (m) => void runner.infos.push(m),
    warning: (m) => void runner.warnings.push(m),
    annotate: (a) => void runner.annotations.push(a),
    writeSummary: async (m) => void runner.summaries.push(m),
    setOutput: (name, value) => void (runner.outputs[name] = value),
  };
  return runner;
}
