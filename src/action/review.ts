/**
 * One run of the action: choose the records, audit them against the whole registry, write the SARIF file, the
 * report, the annotations, the outputs and the job summary, then post to the pull request, and judge by the
 * threshold. Everything is written before anything is posted, so a failing or stalled API loses no result; what
 * posting did is added to the job summary afterwards. The token never reaches the summary.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { dirname } from 'node:path';
import type { AuditResult } from '../audit/types.js';
import { buildAnnotations } from '../github/annotations.js';
import type { GitHubClient } from '../github/client.js';
import { writeSarifFile } from '../github/sarif-file.js';
import { redactSecret } from '../github/redact.js';
import { escapeMarkdown } from '../report/escape.js';
import { chooseRecords, message } from './choose-records.js';
import type { Engine, Runner } from './ports.js';
import { postReview } from './post-review.js';
import type { ActionSettings, FailOn } from './settings.js';
import { plural } from '../checks/words.js';

/** The job summary may hold 1 MiB (GitHub docs, "Adding a job summary"); leave room for the lines about posting. */
export const SUMMARY_MAX_BYTES = 1_000_000;
/** When the full checklist is larger than that: the short form, at most this long (emoji take four bytes). */
export const SUMMARY_SHORT_CHARS = 240_000;

export interface ReviewOutcome {
  result: AuditResult;
  /** Why the step fails, or null when it passes. */
  failure: string | null;
}

export async function review(
  settings: ActionSettings,
  engine: Engine,
  client: GitHubClient | null,
  runner: Runner,
): Promise<ReviewOutcome> {
  const chosen = await chooseRecords(settings, engine, client, runner);
  const result = await engine.audit({
    root: settings.registryRoot,
    ...(chosen.paths === undefined ? {} : { paths: chosen.paths }),
    ...(settings.configFile === null ? {} : { configFile: settings.configFile }),
    ...(settings.indexCache === null ? {} : { indexCache: settings.indexCache }),
    log: (line) => runner.info(line),
  });
  const { errors, warnings, notes, waived } = result.summary;
  runner.info(
    `Audited ${plural(result.summary.records, 'record')}: ${plural(errors, 'error')}, ${plural(warnings, 'warning')}, ${plural(notes, 'note')}` +
      (waived > 0 ? `, ${waived} accepted by waivers.` : '.'),
  );

  const written: string[] = [];
  if (settings.sarifFile !== null) {
    try {
      await writeSarifFile(settings.sarifFile, engine.renderSarif(result, settings.registryDir));
      written.push(`SARIF: ${settings.sarifFile}`);
    } catch (error) {
      runner.warning(`Could not write the SARIF file ${settings.sarifFile}: ${message(error)}`);
    }
  }
  if (settings.reportFile !== null) {
    try {
      await mkdir(dirname(settings.reportFile), { recursive: true });
      await writeFile(
        settings.reportFile,
        redactSecret(engine.renderMarkdown(result, { maxChars: Number.POSITIVE_INFINITY }), settings.token),
        'utf8',
      );
      written.push(`report: ${settings.reportFile}`);
    } catch (error) {
      runner.warning(`Could not write the report ${settings.reportFile}: ${message(error)}`);
    }
  }
  if (written.length > 0) runner.info(`Wrote ${written.join(', ')}.`);
  if (result.unmatched !== undefined && result.unmatched.length > 0) {
    runner.info(`No record uses ${result.unmatched.join(', ')}.`);
  }

  const { annotations, omitted } = buildAnnotations(result, settings.registryDir);
  for (const annotation of annotations) runner.annotate(annotation);
  if (omitted > 0)
    runner.info(
      `${plural(omitted, 'more finding is', 'more findings are')} not annotated (GitHub shows a limited number); see the summary.`,
    );

  runner.setOutput('errors', errors);
  runner.setOutput('warnings', warnings);
  runner.setOutput('notes', notes);
  runner.setOutput('sarif-file', settings.sarifFile ?? '');
  runner.setOutput('report-file', settings.reportFile ?? '');

  // Everything computed is on record before anything is posted: a stalled or failing API loses nothing.
  const redact = (text: string): string => redactSecret(text, settings.token);
  try {
    // The full checklist, as in the report file, unless it is larger than a job summary may be.
    const full = engine.renderMarkdown(result, { maxChars: Number.POSITIVE_INFINITY });
    const summary =
      Buffer.byteLength(full, 'utf8') <= SUMMARY_MAX_BYTES
        ? full
        : engine.renderMarkdown(result, { maxChars: SUMMARY_SHORT_CHARS });
    await runner.writeSummary(redact(`${summary}\n`));
  } catch (error) {
    runner.warning(`Could not write the job summary: ${message(error)}`);
  }

  let posted: string[];
  try {
    posted = await postReview(settings, result, chosen, engine, client, runner);
  } catch (error) {
    posted = [`Posting to the pull request failed: ${redact(message(error))}`];
    runner.warning(posted[0]!);
  }
  try {
    await runner.writeSummary(redact(`\n${posted.map((line) => `- ${escapeMarkdown(line)}`).join('\n')}\n`));
  } catch (error) {
    runner.warning(`Could not add to the job summary: ${message(error)}`);
  }

  return { result, failure: judge(result, settings.failOn) };
}

/** Waived findings are not counted in the summary, so they never fail the step. */
export function judge(result: AuditResult, failOn: FailOn): string | null {
  const { errors, warnings } = result.summary;
  if (failOn === 'never') return null;
  if (failOn === 'error' && errors > 0)
    return `stereogate found ${plural(errors, 'error')} (fail-on: error).`;
  if (failOn === 'warning' && errors + warnings > 0) {
    return `stereogate found ${plural(errors, 'error')} and ${plural(warnings, 'warning')} (fail-on: warning).`;
  }
  return null;
}
