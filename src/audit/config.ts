/**
 * Audit configuration: the defaults (each with where it comes from), and the config file
 * `stereogate.config.yml` / `.yaml` / `.json` at the registry root (schema/config.schema.json).
 */
import { existsSync } from 'node:fs';
import { isAbsolute, join, resolve } from 'node:path';
import { readTextFile } from '../registry/files.js';
import { parseDocumentText } from '../registry/parse.js';
import { lineOf } from '../registry/positions.js';
import { validateConfigShape } from '../registry/schema.js';
import type { AuditConfig } from '../checks/types.js';

export const DEFAULT_CONFIG: Readonly<AuditConfig> = Object.freeze({
  recordDirs: ['compounds'],
  severities: {},
  ratioSumTolerance: 1,
  racemateRatioTolerance: 2,
  eeTolerance: 1,
  singleEnantiomerMinEe: 98,
  zeroRotationTolerance: 1,
  axisOrthoMin: 3,
});

/** Where each default comes from. */
export const DEFAULT_SOURCES: Readonly<Record<keyof AuditConfig, string>> = Object.freeze({
  recordDirs: 'the record format of this project (records live under compounds/ unless configured)',
  severities:
    'none overridden: every check keeps the default severity its module declares. A level given for a check ' +
    "sets the level of that check's failures (raised or lowered; note-level messages stay notes); a level given " +
    "for 'check-id/message-id' sets that one message's level, notes included",
  ratioSumTolerance:
    'common practice, no source: ratios are usually reported rounded to whole percent, so three rounded parts ' +
    'may miss 100 by up to 1.5 points; 1 point catches typing errors without flagging ordinary rounding of two parts',
  racemateRatioTolerance:
    'common practice, no source: a racemate measured by chiral chromatography typically reads within about ' +
    '2 points of 50:50 (integration error); more than that suggests an enantioenriched sample',
  eeTolerance: 'common practice, no source: ee and ratios are reported rounded to about 1 percent',
  singleEnantiomerMinEe:
    'common practice, no source: many registries call a sample a single enantiomer from about 98 % ee ' +
    '(99:1 er); set your own SOP value',
  zeroRotationTolerance:
    'from memory: polarimeters read the observed rotation to about ±0.01°, which at c = 1 g/100 mL in a 1 dm cell ' +
    'is ±1° of specific rotation ([α] = 100·α / (l·c))',
  axisOrthoMin:
    'common practice, no source: biaryls with three or four ortho substituents usually rotate slowly enough ' +
    'for atropisomers to be isolated at room temperature, with two they usually do not; a fused ring at an ' +
    "ortho position counts twice (its peri C–H), so 1,1'-binaphthyl qualifies",
});

export const CONFIG_FILE_NAMES = [
  'stereogate.config.yml',
  'stereogate.config.yaml',
  'stereogate.config.json',
];

/** A config file that cannot be used, or options that make no sense: a usage error, not a finding. */
export class ConfigError extends Error {
  override name = 'ConfigError';
}

export interface LoadedConfig {
  config: AuditConfig;
  /** Path of the file that was read (as given or found), null when none. */
  file: string | null;
}

/** Defaults, then the config file (explicit, or found at the root), then `overrides`. */
export function loadConfig(
  root: string,
  configFile?: string,
  overrides?: Partial<AuditConfig>,
): LoadedConfig {
  let file: string | null = null;
  if (configFile !== undefined) {
    file = isAbsolute(configFile) ? configFile : resolve(configFile);
    if (!existsSync(file)) throw new ConfigError(`config file ${configFile} does not exist`);
  } else {
    const found = CONFIG_FILE_NAMES.map((n) => join(root, n)).find((p) => existsSync(p));
    file = found ?? null;
  }
  const fromFile = file === null ? {} : readConfigFile(file, configFile ?? file);
  const config: AuditConfig = {
    ...DEFAULT_CONFIG,
    recordDirs: [...DEFAULT_CONFIG.recordDirs],
    ...fromFile,
    ...(overrides ?? {}),
    severities: {
      ...DEFAULT_CONFIG.severities,
      ...(fromFile.severities ?? {}),
      ...(overrides?.severities ?? {}),
    },
  };
  return { config, file };
}

function readConfigFile(abs: string, shown: string): Partial<AuditConfig> {
  const read = readTextFile(abs);
  if (!read.ok) throw new ConfigError(`config file ${shown} ${read.error}`);
  const parsed = parseDocumentText(read.text);
  const issues = parsed.problems.map((p) => `${shown} line ${p.line}: ${p.message}`);
  if (issues.length === 0) {
    if (parsed.value === null || parsed.value === undefined) return {};
    for (const p of validateConfigShape(parsed.value)) {
      const line = lineOf(parsed.positions, p.path);
      issues.push(`${shown}${line === null ? '' : ` line ${line}`}: ${p.message}`);
    }
  }
  if (issues.length > 0) throw new ConfigError(`the config file is not valid:\n  ${issues.join('\n  ')}`);
  return parsed.value as Partial<AuditConfig>;
}

/**
 * Severities naming a check that does not exist are a usage error (a typo would silently do nothing); so are
 * 'check-id/message-id' keys whose message the check does not have (when `messagesOf` knows the check's messages).
 */
export function checkSeverityIds(
  config: AuditConfig,
  knownIds: readonly string[],
  suggest: (w: string) => string | null,
  messagesOf?: (checkId: string) => readonly string[] | undefined,
): void {
  const unknown: string[] = [];
  for (const key of Object.keys(config.severities)) {
    const cut = key.indexOf('/');
    const id = cut < 0 ? key : key.slice(0, cut);
    if (!knownIds.includes(id)) {
      const guess = suggest(id);
      unknown.push(guess ? `'${key}' (did you mean '${guess}'?)` : `'${key}'`);
      continue;
    }
    if (cut < 0) continue;
    const message = key.slice(cut + 1);
    const known = messagesOf?.(id);
    if (known !== undefined && !known.includes(message)) {
      unknown.push(`'${key}' (${id} has no message '${message}'; its messages: ${known.join(', ')})`);
    }
  }
  if (unknown.length === 0) return;
  throw new ConfigError(
    `severities: no check or message is called ${unknown.join(', ')}; known checks: ${knownIds.join(', ')}`,
  );
}
