/**
 * The audit's reports written as the records come, one record at a time, never the whole result in memory:
 * byte for byte what renderText, renderMarkdown (whole, not summarised), renderJson and renderSarif write for
 * the same records in the same order. JSON and SARIF stream straight through (their totals come last); the text
 * and Markdown reports list records in groups (errors first), kept in temporary files until the end.
 * A record may come without its facts (a streamed audit keeps them in its worker): then with the computed line
 * the checklists show and the facts' JSON text.
 */
import type { AuditResult, RecordResult } from '../audit/types.js';
import type { CheckModule } from '../checks/types.js';
import { jsonRecord, renderJson } from './json.js';
import { cautionBlock, cleanHeading, markdownHead, markdownRecord } from './markdown.js';
import { sarifInvocations, sarifLog, sarifResults, type SarifOptions } from './sarif.js';
import { NotRunTally } from './not-run.js';
import { SpillGroups, type ReportSink } from './sink.js';
import { textClosing, textRecord, type TextOptions } from './text.js';

export interface StreamedRecord {
  result: RecordResult;
  /** computedText of the facts, when `result.computed` was left out. */
  computedLine?: string | null;
  /** JSON.stringify(facts, null, 2), when `result.computed` was left out. */
  computedJson?: string | null;
}

/** The whole result but its records: what a report writes after them. */
export type ResultTotals = Omit<AuditResult, 'records'>;

export interface StreamedReport {
  add(r: StreamedRecord): Promise<void>;
  /** Writes what follows the records and closes the sink. */
  finish(totals: ResultTotals): Promise<void>;
  /** The run stopped: drop what is kept for the end (the sink is left as it is). */
  abort(): void;
}

export type ReportFormat = 'text' | 'json' | 'markdown' | 'sarif';

export function streamedReport(
  format: ReportFormat,
  sink: ReportSink,
  known: Pick<ResultTotals, 'tool' | 'caution'>,
  options: { text?: TextOptions; checks?: readonly CheckModule[]; sarif?: SarifOptions } = {},
): StreamedReport {
  if (format === 'json') return jsonReport(sink);
  if (format === 'sarif') return sarifReport(sink, options.checks ?? [], known, options.sarif);
  return groupedReport(format, sink, options.text ?? {});
}

const line = (r: StreamedRecord) =>
  r.computedLine !== undefined && r.result.computed === null ? r.computedLine : undefined;

/** `text`, the value of a JSON array element at `depth` in a document indented by two spaces a level. */
function nested(text: string, depth: number): string {
  const pad = ' '.repeat(2 * depth);
  return pad + text.replace(/\n/g, `\n${pad}`);
}

/** The frame of an indented JSON document around one empty array `[]` (the first one after `key`). */
function frame(doc: string, key: string): [string, string] {
  const at = doc.indexOf(`${key}: []`);
  if (at < 0) throw new Error(`streamed report: no empty ${key} array in the frame`);
  const open = at + key.length + 3;
  return [doc.slice(0, open), doc.slice(open + 1)];
}

/** An indented JSON array written an element at a time (`[]` when empty, as JSON.stringify writes it). */
function arrayWriter(sink: ReportSink, depth: number) {
  let count = 0;
  return {
    add: (elementJson: string) => sink.write(`${count++ === 0 ? '\n' : ',\n'}${nested(elementJson, depth)}`),
    end: () => sink.write(count === 0 ? ']' : `\n${' '.repeat(2 * (depth - 1))}]`),
  };
}

const MARK = '\u0000computed';

function jsonReport(sink: ReportSink): StreamedReport {
  const records = arrayWriter(sink, 2);
  let started = false;
  const start = async () => {
    if (!started) await sink.write('{\n  "records": [');
    started = true;
  };
  return {
    async add(r) {
      await start();
      const facts = r.result.computed === null ? (r.computedJson ?? null) : null;
      const obj = jsonRecord(r.result);
      if (facts !== null) obj.computed = MARK;
      let text = JSON.stringify(obj, null, 2);
      if (facts !== null) {
        const marked = `"computed": ${JSON.stringify(MARK)}`;
        const at = text.indexOf(marked);
        text = `${text.slice(0, at)}"computed": ${facts.replace(/\n/g, '\n  ')}${text.slice(at + marked.length)}`;
      }
      await records.add(text);
    },
    async finish(totals) {
      await start();
      await records.end();
      const [head, tail] = frame(renderJson({ ...totals, records: [] }), '"records"');
      if (head !== '{\n  "records": [') throw new Error('streamed report: the JSON report changed its frame');
      await sink.write(tail);
      await sink.close();
    },
    abort: () => undefined,
  };
}

/**
 * SARIF: the run's invocation (checks not run, gathered over every record) stands before the results, so the
 * results wait in a temporary file until the end.
 */
function sarifReport(
  sink: ReportSink,
  checks: readonly CheckModule[],
  known: Pick<ResultTotals, 'tool' | 'caution'>,
  options: SarifOptions | undefined,
): StreamedReport {
  const none = { records: 0, errors: 0, warnings: 0, notes: 0, waived: 0 };
  // the log without records: its rules (their help ends with the caution) are known up front
  const empty = (totals: ResultTotals) =>
    sarifLog({ ...totals, records: [] }, checks, options) as { runs: Record<string, unknown>[] };
  const rules = (empty({ ...known, summary: none }).runs[0]!.tool as { driver: { rules: { id: string }[] } })
    .driver.rules;
  const index = new Map(rules.map((r, i) => [r.id, i]));
  const prefix = options?.uriPrefix ? options.uriPrefix.replace(/\/?$/, '/') : '';
  const notRun = new NotRunTally();
  const results = new SpillGroups(1);
  let count = 0;
  return {
    async add(r) {
      notRun.add({ id: r.result.id, file: r.result.file, line: null }, r.result.notRun);
      for (const res of sarifResults(r.result, index, options))
        results.add(0, `${count++ === 0 ? '\n' : ',\n'}${nested(JSON.stringify(res, null, 2), 4)}`);
    },
    async finish(totals) {
      try {
        const log = empty(totals);
        const { tool, properties } = log.runs[0]!;
        const invocations = sarifInvocations(notRun.list(), index, prefix);
        log.runs[0] = { tool, ...(invocations ? { invocations } : {}), results: [], properties };
        const [head, tail] = frame(`${JSON.stringify(log, null, 2)}\n`, '"results"');
        await sink.write(head);
        await results.copy(0, sink);
        await sink.write(count === 0 ? ']' : '\n      ]');
        await sink.write(tail);
        await sink.close();
      } finally {
        results.remove();
      }
    },
    abort: () => results.remove(),
  };
}

/** Text or Markdown: records by group (errors, warnings, notes, none open), each group in the audit's order. */
function groupedReport(format: 'text' | 'markdown', sink: ReportSink, options: TextOptions): StreamedReport {
  const groups = new SpillGroups(4);
  return {
    async add(r) {
      if (format === 'text') {
        const { group, lines } = textRecord(r.result, options, line(r));
        groups.add(group, lines.map((l) => `${l}\n`).join(''));
      } else {
        const { group, text } = markdownRecord(r.result, line(r));
        groups.add(group, `${text}\n\n`);
      }
    },
    async finish(totals) {
      try {
        if (format === 'markdown') await sink.write(lines(markdownHead(totals)));
        for (let g = 0; g < 3; g++) await groups.copy(g, sink);
        const clean = groups.counts[3]!;
        if (format === 'markdown' && clean > 0) await sink.write(lines([cleanHeading(clean), '']));
        await groups.copy(3, sink);
        await sink.write(
          format === 'text' ? lines(textClosing(totals, options, clean > 0)) : lines([cautionBlock(totals)]),
        );
        await sink.close();
      } finally {
        groups.remove();
      }
    },
    abort: () => groups.remove(),
  };
}

const lines = (ls: readonly string[]) => ls.map((l) => `${l}\n`).join('');
