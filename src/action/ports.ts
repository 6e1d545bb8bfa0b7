/** What the action's steps are given: the audit and reports (engine) and the runner (log, annotations, outputs). */
import type { AuditResult } from '../audit/types.js';
import type { Annotation } from '../github/annotations.js';

export interface Engine {
  /** `paths` undefined: every record; []: none. */
  audit(options: {
    root: string;
    paths?: string[];
    configFile?: string;
    /** File keeping the registry's key index between runs (a review's cache). */
    indexCache?: string;
    /** Lines about the work done (the index and its cache) for the log. */
    log?: (line: string) => void;
  }): Promise<AuditResult>;
  /** The record folders the config names (relative to the registry root). */
  recordDirs(root: string, configFile: string | null): Promise<string[]>;
  renderMarkdown(result: AuditResult, options: { maxChars?: number; detailsUrl?: string }): string;
  /** The SARIF log, artifact URIs prefixed with `uriPrefix` (the registry folder in the repository). */
  renderSarif(result: AuditResult, uriPrefix: string): object;
}

export interface Runner {
  info(message: string): void;
  warning(message: string): void;
  annotate(annotation: Annotation): void;
  writeSummary(markdown: string): Promise<void>;
  setOutput(name: string, value: string | number): void;
}
