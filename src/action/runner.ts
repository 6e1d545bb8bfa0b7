/** The runner as the action sees it, through @actions/core: log lines, annotations, outputs, the job summary. */
import * as core from '@actions/core';
import type { Runner } from './ports.js';

export const coreRunner: Runner = {
  info: (message) => core.info(message),
  warning: (message) => core.warning(message),
  annotate: (a) => {
    const properties = { title: a.title, file: a.file, ...(a.line === null ? {} : { startLine: a.line }) };
    if (a.level === 'error') core.error(a.message, properties);
    else if (a.level === 'warning') core.warning(a.message, properties);
    else core.notice(a.message, properties);
  },
  writeSummary: async (markdown) => {
    if (!process.env.GITHUB_STEP_SUMMARY) {
      core.info('No GITHUB_STEP_SUMMARY file: the job summary is not written.');
      return;
    }
    await core.summary.addRaw(markdown, true).write();
  },
  setOutput: (name, value) => core.setOutput(name, value),
};
