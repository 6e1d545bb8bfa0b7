/** The real audit and reports behind the action's Engine port. */
import { CAUTION } from '../audit/caution.js';
import { loadConfig } from '../audit/config.js';
import { runAudit, summarize } from '../audit/run.js';
import type { AuditResult } from '../audit/types.js';
import { VERSION } from '../audit/version.js';
import { CHECKS } from '../checks/index.js';
import { renderMarkdown } from '../report/markdown.js';
import { sarifLog } from '../report/sarif.js';
import type { Engine } from './ports.js';

export const engine: Engine = {
  async audit(options) {
    // runAudit takes no paths as "every record"; a pull request that changes no record audits none.
    if (options.paths !== undefined && options.paths.length === 0) return emptyResult();
    return runAudit(options);
  },
  async recordDirs(root, configFile) {
    return loadConfig(root, configFile ?? undefined).config.recordDirs;
  },
  renderMarkdown: (result, options) => renderMarkdown(result, options),
  renderSarif: (result, uriPrefix) => sarifLog(result, CHECKS, { uriPrefix }),
};

export function emptyResult(): AuditResult {
  return {
    tool: { name: 'stereogate', version: VERSION },
    records: [],
    summary: summarize([]),
    caution: CAUTION,
  };
}
