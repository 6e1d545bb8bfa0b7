/** Option parsing for the commands (node:util parseArgs, strict), turning its errors into UsageError. */
import { parseArgs } from 'node:util';
import { UsageError } from './command.js';

export interface OptionSpec {
  [name: string]: {
    type: 'string' | 'boolean';
    short?: string;
    choices?: readonly string[];
    default?: string | boolean;
  };
}

export function parseCommandArgs(
  args: string[],
  spec: OptionSpec,
  positionals: { min: number; max: number; names: string },
): { values: Record<string, string | boolean | undefined>; positionals: string[] } {
  let parsed;
  try {
    const options = Object.fromEntries(
      Object.entries(spec).map(([k, v]) => [
        k,
        {
          type: v.type,
          ...(v.short ? { short: v.short } : {}),
          ...(v.default !== undefined ? { default: v.default } : {}),
        },
      ]),
    );
    parsed = parseArgs({ args, options, allowPositionals: true, strict: true });
  } catch (e) {
    throw new UsageError((e as Error).message.replace(/\. To specify a positional.*$/s, ''));
  }
  for (const [k, v] of Object.entries(spec)) {
    const got = parsed.values[k];
    if (v.choices && typeof got === 'string' && !v.choices.includes(got)) {
      throw new UsageError(`--${k} must be one of ${v.choices.join(', ')} (got "${got}")`);
    }
  }
  const pos = parsed.positionals;
  if (pos.length < positionals.min) throw new UsageError(`missing ${positionals.names}`);
  if (pos.length > positionals.max)
    throw new UsageError(`too many arguments: ${pos.slice(positionals.max).join(' ')}`);
  return { values: parsed.values as Record<string, string | boolean | undefined>, positionals: pos };
}
