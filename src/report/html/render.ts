/**
 * The bulk audit's visual report: ONE self-contained HTML file (no external scripts, styles, fonts or images),
 * with counts by check and severity, a table of flagged records that can be filtered by check, severity and
 * declared form and searched by id, and for each flagged record its depiction (SVG, CIP labels at the atoms)
 * with declared and computed stereo side by side.
 *
 * Everything from records is escaped; the record data travels as JSON inside a <script type="application/json">
 * block with `<` escaped, and is put into the page with textContent, never innerHTML. SVG depictions are
 * produced by our own depiction code (never taken from records) and embedded as data: URIs in <img> tags, which
 * browsers render without running scripts.
 */
import type { AuditResult, RecordResult } from '../../audit/types.js';
import type { StructureFacts } from '../../chem/facts.js';
import { PAGE_SCRIPT } from './page-script.js';
import { PAGE_STYLE } from './page-style.js';

export interface HtmlReportOptions {
  title?: string;
  /** SVG per record index (only flagged records need one). */
  depictions?: Map<number, string>;
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
  descriptors: string;
  computed: string;
  labels: string;
  worst: 'error' | 'warning' | 'note';
  findings: {
    check: string;
    severity: string;
    message: string;
    line: number | null;
    waived: string | null;
  }[];
}

export type CheckCounts = Record<string, { error: number; warning: number; note: number; waived: number }>;

/** What a page row reads of a record: the record result, with only these computed facts needed. */
export type HtmlRecord = Omit<RecordResult, 'computed'> & {
  computed: Pick<StructureFacts, 'chiral' | 'meso' | 'units' | 'undefined' | 'stereoisomers'> | null;
};

function computedSummary(r: HtmlRecord): { text: string; labels: string } {
  const c = r.computed;
  if (!c) return { text: 'structure not read', labels: '' };
  const chir = c.chiral === null ? 'chirality open (undefined units)' : c.chiral ? 'chiral' : 'achiral';
  const parts = [chir];
  if (c.meso) parts.push('meso');
  parts.push(`${c.units.length} stereo unit${c.units.length === 1 ? '' : 's'}, ${c.undefined} undefined`);
  parts.push(
    `${c.stereoisomers.total} stereoisomers (${c.stereoisomers.chiral} chiral, ${c.stereoisomers.achiral} achiral)`,
  );
  const labels = c.units
    .filter((u) => u.label)
    .map((u) => `${u.atoms.join('=')}${u.label}`)
    .join(', ');
  return { text: parts.join('; '), labels };
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
    descriptors: r.declared.descriptors ?? '',
    computed: cs.text,
    labels: cs.labels,
    worst,
    findings: r.findings.map((f) => ({
      check: f.check,
      severity: f.severity,
      message: f.message,
      line: f.line,
      waived: f.waived ? `accepted by ${f.waived.approvedBy}: ${f.waived.reason}` : null,
    })),
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
  const rows: (HtmlRow & { svg?: string | null })[] = [];
  result.records.forEach((r, i) => {
    const row = htmlRow(r);
    if (row) rows.push({ ...row, svg: opts.depictions?.get(i) ?? null });
  });
  return renderHtmlPage(rows, {
    tool: result.tool,
    caution: result.caution,
    summary: result.summary,
    byCheck: countByCheck(result.records),
    ...opts,
  });
}

export interface HtmlPage extends Omit<HtmlReportOptions, 'depictions'> {
  tool: AuditResult['tool'];
  caution: string;
  summary: AuditResult['summary'];
  byCheck: CheckCounts;
  /** Flagged records in all, when only some are listed (a capped bulk report). */
  flaggedTotal?: number;
}

/** The page from rows already made (bulk runs keep rows, not whole results); `svg` is the depiction, if any. */
export function renderHtmlPage(rows: readonly (HtmlRow & { svg?: string | null })[], page: HtmlPage): string {
  const opts = page;
  const data = rows.map((r, i) => ({
    ...r,
    i,
    svg: r.svg ? `data:image/svg+xml;base64,${Buffer.from(r.svg, 'utf8').toString('base64')}` : null,
  }));
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
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; img-src data:; style-src 'unsafe-inline'; script-src 'unsafe-inline'">
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
<table class="counts"><thead><tr><th>check</th><th>errors</th><th>warnings</th><th>notes</th><th>waived</th></tr></thead>
<tbody>${countsRows}</tbody></table>
</section>
<section aria-label="flagged records">
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
</form>
<div id="records"></div>
<p id="empty" hidden>No flagged record matches these filters.</p>
</section>
<script type="application/json" id="report-data">${scriptJson(data)}</script>
<script>${PAGE_SCRIPT}</script>
</body>
</html>
`;
}
