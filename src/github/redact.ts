/**
 * Keeps a secret (the API token) out of everything the action shows: a server that echoes the token in an error
 * message must not get it into the job summary, a comment or a log line. Masked as written and in every form the
 * reports may turn it into (Markdown-escaped, JSON-escaped, URL-encoded).
 */
import { escapeMarkdown } from '../report/escape.js';

export const MASK = '***';

export function redactSecret(text: string, secret: string): string {
  if (secret.length < 4) return text;
  const forms = new Set([
    secret,
    escapeMarkdown(secret),
    JSON.stringify(secret).slice(1, -1),
    encodeURIComponent(secret),
  ]);
  let out = text;
  for (const form of [...forms].sort((a, b) => b.length - a.length)) {
    if (form !== '') out = out.split(form).join(MASK);
  }
  return out;
}
