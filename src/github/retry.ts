/**
 * When to try a GitHub API request again, and after how long. Pure: the client asks, this answers.
 *
 * GitHub's REST documentation ("Rate limits for the REST API", "Best practices for using the REST API") says:
 * on a secondary rate limit the answer is 403 or 429; wait `Retry-After` seconds when that header is present; when
 * `x-ratelimit-remaining` is 0 wait until `x-ratelimit-reset` (epoch seconds); otherwise wait at least a minute.
 * 5xx answers are transient server trouble and are retried with a growing back-off (common practice, no source).
 *
 * A request that is not idempotent (creating a comment) is never sent again after an answer that leaves open
 * whether it was carried out: a timeout, a reset connection or a 5xx. The caller looks first (src/github/
 * checklist-comment.ts, inline-comments.ts). A rate-limit refusal is safe to repeat: GitHub did not act on it.
 */

export interface RetryPolicy {
  /** Total attempts, the first one included. */
  maxTries: number;
  /** First back-off for 5xx and network errors; doubled on every further attempt. */
  baseDelayMs: number;
  /** A wait longer than this is not worth it: give up and report the error instead. */
  maxDelayMs: number;
}

export const DEFAULT_RETRY_POLICY: RetryPolicy = { maxTries: 3, baseDelayMs: 1000, maxDelayMs: 90_000 };

export interface AnswerSeen {
  status: number;
  headers: { get(name: string): string | null };
  /** Body text (only read for 403/429, to tell a rate limit from a permission problem). */
  bodyText: string;
}

/** True when a 403/429 answer is a rate limit (primary or secondary) rather than a permission refusal. */
export function isRateLimit(answer: AnswerSeen): boolean {
  if (answer.status === 429) return true;
  if (answer.status !== 403) return false;
  if (answer.headers.get('retry-after') !== null) return true;
  if (answer.headers.get('x-ratelimit-remaining') === '0') return true;
  return /rate limit/i.test(answer.bodyText);
}

/**
 * How long a rate-limited answer asks to wait, in milliseconds (Retry-After, else the primary limit's reset, else
 * GitHub's "at least a minute"); null when the answer is not a rate limit.
 */
export function rateLimitWaitMs(answer: AnswerSeen, nowMs: number = Date.now()): number | null {
  if (!isRateLimit(answer)) return null;
  return retryAfterMs(answer, nowMs) ?? resetWaitMs(answer, nowMs) ?? 60_000;
}

/**
 * Milliseconds to wait before the next attempt, or null when the answer must not be retried (success, a client
 * error, attempts used up, or a wait longer than the policy allows). `attempt` is the 1-based attempt just made.
 * `answer` null means the request failed without an answer (network error or timeout). With `idempotent` false,
 * only a rate-limit refusal is retried.
 */
export function retryDelayMs(
  answer: AnswerSeen | null,
  attempt: number,
  policy: RetryPolicy = DEFAULT_RETRY_POLICY,
  nowMs: number = Date.now(),
  idempotent = true,
): number | null {
  if (attempt >= policy.maxTries) return null;
  let delay: number;
  if (answer === null || answer.status >= 500) {
    if (!idempotent) return null;
    delay = policy.baseDelayMs * 2 ** (attempt - 1);
    const after = answer === null ? null : retryAfterMs(answer, nowMs);
    if (after !== null) delay = after;
  } else {
    const wait = rateLimitWaitMs(answer, nowMs);
    if (wait === null) return null;
    delay = wait;
  }
  return delay <= policy.maxDelayMs ? delay : null;
}

/** `Retry-After` as milliseconds: either delta-seconds or an HTTP date (RFC 9110 §10.2.3). */
function retryAfterMs(answer: AnswerSeen, nowMs: number = Date.now()): number | null {
  const raw = answer.headers.get('retry-after');
  if (raw === null) return null;
  const trimmed = raw.trim();
  if (/^\d+$/.test(trimmed)) return Number(trimmed) * 1000;
  const date = Date.parse(trimmed);
  return Number.isNaN(date) ? null : Math.max(0, date - nowMs);
}

function resetWaitMs(answer: AnswerSeen, nowMs: number): number | null {
  if (answer.headers.get('x-ratelimit-remaining') !== '0') return null;
  const reset = Number(answer.headers.get('x-ratelimit-reset'));
  if (!Number.isFinite(reset) || reset <= 0) return null;
  return Math.max(0, reset * 1000 - nowMs) + 1000;
}
