/**
 * The bulk audit's visual report: ONE self-contained HTML file (no external scripts, styles, fonts or images),
 * with counts by check and severity and the flagged records, filtered by check, severity and declared form and
 * searched by id, shown a page at a time; each card has the record's depiction (its own molfile coordinates and
 * wedges when it has them; CIP labels at the atoms, undefined stereo units marked, atom numbers on request) with
 * declared (and the legacy word as written) and computed stereo side by side.
 *
 * It stays light at its limit: the records travel as compact JSON (a depiction is its 2D layout, ~1 KB), the
 * page builds only the cards of the page shown and draws a depiction only when its card comes into view.
 * Everything from records is escaped; the data sits in a <script type="application/json"> block with `<`
 * escaped, and is put into the page with textContent and SVG elements made by the page script, never innerHTML.
 */
import type { AuditResult, RecordResult } from '../../audit/types.js';
import type { StructureFacts } from '../../chem/facts.js';
import { notRunGroups, notRunRecordsText, type NotRunGroup } from '../not-run.js';
import { PAGE_SCRIPT } from './page-script.js';
import type { PicData } from './picture.js';
import { PAGE_STYLE } from './page-style.js';

export interface HtmlReportOptions {
  title?: string;
  /** Depiction per record index (only flagged records need one): see picture.ts. */
  pictures?: Map<number, PicData>;
  /** Notes to print under the title (inputs, mapping, vocabulary tally…), plain text. */
  notes?: string[];
  generatedAt?: string;
}

export function escapeHtml(text: string): string {
  return text.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string,
  );
}

/** JSON safe inside a <script> element: no `</script>`, no `<!--`. */
function scriptJson(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, '\\u003c')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}

/** One flagged record as the page shows it (plain data; the page script builds the DOM from it). */
export interface HtmlRow {
  id: string;
  file: string;
  form: string;
  /** The legacy form word as written in the export, when it is not the form's own name. */
  word: string | null;
  descriptors: string;
  computed: string;
  labels: string;
  /** Undefined stereo units, named by their atoms ("C4, C6"); '' when none. */
  undef: string;
  worst: 'error' | 'warning' | 'note';
  findings: {
    check: string;
    severity: string;
    message: string;
    line: number | null;
    waived: string | null;
  }[];
  /** Checks that did not run on the record, with the reason (absent in rows made before it existed). */
  notRun?: { check: string; reason: string }[];
  /** Why the card has no depiction, when it has none and the reason is known (shown on the card). */
  noPicture?: string;
}

export type CheckCounts = Record<string, { error: number; warning: number; note: number; waived: number }>;

/** What a page row reads of a record: the record result, with only these computed facts needed. */
export type HtmlRecord = Omit<RecordResult, 'computed'> & {
  computed: Pick<StructureFacts, 'chiral' | 'meso' | 'units' | 'undefined' | 'stereoisomers'> | null;
};

function unitName(u: { element: string; atoms: number[]; kind: string }): string {
  return u.atoms.length === 1 ? `${u.element}${u.atoms[0]}` : `${u.atoms.join('=')}`;
}

function computedSummary(r: HtmlRecord): { text: string; labels: string; undef: string } {
  const c = r.computed;
  if (!c) return { text: 'structure not read', labels: '', undef: '' };
  const chir = c.chiral === null ? 'chirality open (undefined units)' : c.chiral ? 'chiral' : 'achiral';
  const parts = [chir];
  if (c.meso) parts.push('meso');
  parts.push(`${c.units.length} stereo unit${c.units.length === 1 ? '' : 's'}, ${c.undefined} undefined`);
  parts.push(
    `${c.stereoisomers.total} stereoisomers (${c.stereoisomers.chiral} chiral, ${c.stereoisomers.achiral} achiral)`,
  );
  const labels = c.units
    .filter((u) => u.label)
    .map((u) => `${unitName(u)} ${u.label}`)
    .join(', ');
  const undef = c.units
    .filter((u) => !u.defined)
    .map(unitName)
    .join(', ');
  return { text: parts.join('; '), labels, undef };
}

const RANK = { error: 0, warning: 1, note: 2 } as const;

/** The page row of a record, or null when it has no open finding (only flagged records are listed). */
export function htmlRow(r: HtmlRecord): HtmlRow | null {
  const open = r.findings.filter((f) => !f.waived);
  if (open.length === 0) return null;
  const worst = open.reduce<'error' | 'warning' | 'note'>(
    (w, f) => (RANK[f.severity] < RANK[w] ? f.severity : w),
    'note',
  );
  const cs = computedSummary(r);
  return {
    id: r.id ?? '(no id)',
    file: r.file,
    form: r.declared.form ?? '(none)',
    word: null,
    descriptors: r.declared.descriptors ?? '',
    computed: cs.text,
    labels: cs.labels,
    undef: cs.undef,
    worst,
    findings: r.findings.map((f) => ({
      check: f.check,
      severity: f.severity,
      message: f.message,
      line: f.line,
      waived: f.waived
        ? `accepted by ${f.waived.approvedBy}: ${f.waived.reason}` +
          (f.waived.covers ? `; the waiver covers ${f.waived.covers}` : '')
        : null,
    })),
    notRun: (r.notRun ?? []).map((n) => ({ check: n.check, reason: n.reason })),
  };
}

/** Counts by check over all records (waived findings counted apart). */
export function countByCheck(records: readonly RecordResult[]): CheckCounts {
  const byCheck: CheckCounts = {};
  for (const r of records) {
    for (const f of r.findings) {
      const e = (byCheck[f.check] ??= { error: 0, warning: 0, note: 0, waived: 0 });
      if (f.waived) e.waived++;
      else e[f.severity]++;
    }
  }
  return byCheck;
}

export function renderHtml(result: AuditResult, opts: HtmlReportOptions = {}): string {
  const rows: (HtmlRow & { pic?: PicData | null })[] = [];
  result.records.forEach((r, i) => {
    const row = htmlRow(r);
    if (row) rows.push({ ...row, pic: opts.pictures?.get(i) ?? null });
  });
  return renderHtmlPage(rows, {
    tool: result.tool,
    caution: result.caution,
    summary: result.summary,
    byCheck: countByCheck(result.records),
    notRun: notRunGroups(result.records),
    ...opts,
  });
}

export interface HtmlPage extends Omit<HtmlReportOptions, 'pictures'> {
  tool: AuditResult['tool'];
  caution: string;
  summary: AuditResult['summary'];
  byCheck: CheckCounts;
  /** Flagged records in all, when only some are listed (a capped bulk report). */
  flaggedTotal?: number;
  /** Checks that did not run, by check and reason, over every record of the run (flagged or not). */
  notRun?: readonly NotRunGroup[];
}

/** The section listing the checks that did not run (neither passed nor failed), or '' when every check ran. */
function notRunSection(groups: readonly NotRunGroup[]): string {
  if (groups.length === 0) return '';
  const rows = groups
    .map(
      (g) =>
        `<tr><td><code>${escapeHtml(g.check)}</code></td><td>${escapeHtml(notRunRecordsText(g))}</td>` +
        `<td>${escapeHtml(g.reason)}</td></tr>`,
    )
    .join('\n');
  return `<section aria-label="checks not run">
<h2>Checks not run</h2>
<p>These checks could not run on some records, so they neither passed nor failed there.</p>
<div class="scroll"><table class="counts notrun"><thead><tr><th>check</th><th>not run on</th><th>why</th></tr></thead>
<tbody>${rows}</tbody></table></div>
</section>
`;
}

/** The page from rows already made (bulk runs keep rows, not whole results); `pic` is the depiction, if any. */
export function renderHtmlPage(
  rows: readonly (HtmlRow & { pic?: PicData | null })[],
  page: HtmlPage,
): string {
  const opts = page;
  const data = rows.map((r) => ({ ...r, pic: r.pic ?? null }));
  const checks = Object.entries(page.byCheck).sort((a, b) => (a[0] < b[0] ? -1 : 1));
  const title = opts.title ?? 'stereogate audit report';
  const s = page.summary;
  const countsRows = checks
    .map(
      ([check, c]) =>
        `<tr><td><code>${escapeHtml(check)}</code></td><td class="n">${c.error}</td><td class="n">${c.warning}</td>` +
        `<td class="n">${c.note}</td><td class="n">${c.waived}</td></tr>`,
    )
    .join('\n');
  const notes = (opts.notes ?? []).map((n) => `<li>${escapeHtml(n)}</li>`).join('');
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; script-src 'unsafe-inline'">
<title>${escapeHtml(title)}</title>
<style>${PAGE_STYLE}</style>
</head>
<body>
<header>
<h1>${escapeHtml(title)}</h1>
<p class="meta">${escapeHtml(page.tool.name)} ${escapeHtml(page.tool.version)}${opts.generatedAt ? ` · ${escapeHtml(opts.generatedAt)}` : ''}</p>
<p class="caution" role="note"><strong>Caution.</strong> ${escapeHtml(page.caution)}</p>
${notes ? `<ul class="notes">${notes}</ul>` : ''}
</header>
<section aria-label="summary" class="summary">
<div class="tile"><span class="big" id="count-records">${s.records}</span> records</div>
<div class="tile err"><span class="big">${s.errors}</span> errors</div>
<div class="tile warn"><span class="big">${s.warnings}</span> warnings</div>
<div class="tile note"><span class="big">${s.notes}</span> notes</div>
<div class="tile"><span class="big">${s.waived}</span> accepted by waiver</div>
</section>
<section aria-label="findings by check">
<h2>Findings by check</h2>
<div class="scroll"><table class="counts"><thead><tr><th>check</th><th>errors</th><th>warnings</th><th>notes</th><th>waived</th></tr></thead>
<tbody>${countsRows}</tbody></table></div>
</section>
${notRunSection(page.notRun ?? [])}<section aria-label="flagged records">
<h2>Flagged records <span id="shown-count">${rows.length}</span> of ${rows.length}${
    page.flaggedTotal !== undefined && page.flaggedTotal > rows.length
      ? ` listed (${page.flaggedTotal} flagged in all)`
      : ''
  }</h2>
<form id="filters" onsubmit="return false">
<label>search id <input id="search" type="search" placeholder="e.g. LX-00042" autocomplete="off"></label>
<label>check <select id="filter-check"><option value="">all checks</option></select></label>
<label>severity <select id="filter-severity"><option value="">any severity</option><option>error</option><option>warning</option><option>note</option></select></label>
<label>declared form <select id="filter-form"><option value="">any form</option></select></label>
<label class="check"><input id="atom-numbers" type="checkbox"> atom numbers</label>
</form>
<p id="empty" hidden>No flagged record matches these filters.</p>
<p class="legend">In the drawings: <b class="cip">R</b>/<b class="cip">S</b>, <b class="cip">E</b>/<b class="cip">Z</b> computed CIP labels; <span class="undef-mark">dashed circles</span> undefined stereo units. A drawing is the record's own molfile (coordinates and wedges as registered) when it has one, else a layout computed from the structure; the card says which.</p>
<div id="records"></div>
<nav id="pager" aria-label="pages" hidden><button type="button" id="prev">‹ previous</button> <span id="page-info"></span> <button type="button" id="next">next ›</button></nav>

</section>
<script type="application/json" id="report-data">${scriptJson(data)}</script>
<script>${PAGE_SCRIPT}</script>
</body>
</html>
`;
}
