/**
 * A small GitHub REST client over fetch: JSON in and out, Link-header pagination, a time limit on every request,
 * bounded retries for 5xx answers, timeouts and rate limits — but a request that creates something (POST) is never
 * sent again after an answer that leaves open whether it was carried out; the caller looks first. The token is only
 * ever sent to the configured API origin, and never appears in an error this client raises.
 *
 * Why not @actions/github (Octokit with its retry and throttling plugins): the retry plugin repeats a POST after a
 * 5xx like any other request — the duplicate-comment defect this client exists to avoid — so the plugin would be
 * turned off for every write and the look-before-repeat logic below written anyway. Proxy support is taken from the
 * toolkit all the same (src/github/transport.ts).
 */
import { DEFAULT_RETRY_POLICY, rateLimitWaitMs, retryDelayMs, type RetryPolicy } from './retry.js';
import { redactSecret } from './redact.js';
import { transportFor, type Transport } from './transport.js';

export interface ClientOptions {
  /** e.g. https://api.github.com or https://ghe.example/api/v3 (GITHUB_API_URL). */
  baseUrl: string;
  token: string;
  retry?: Partial<RetryPolicy>;
  /** Time limit of one attempt, answer body included; 30 s by default. */
  timeoutMs?: number;
  /** Injected so tests need not wait; defaults to setTimeout. */
  sleep?: (ms: number) => Promise<void>;
  /** Told about each retry (the action logs it). */
  onRetry?: (info: RetryInfo) => void;
  /** Largest number of pages `paginate` follows (a guard against a server that never stops). */
  maxPages?: number;
  /** How requests go out; by default from the proxy variables (src/github/transport.ts). */
  transport?: Transport;
}

export interface RetryInfo {
  method: string;
  path: string;
  status: number | null;
  /** What went wrong: 'timeout', 'network', 'server' or 'rate-limit'. */
  kind: ErrorKind;
  delayMs: number;
  attempt: number;
}

export interface ApiResponse<T> {
  status: number;
  data: T;
  headers: Headers;
}

/**
 * What went wrong. 'timeout': no answer within the time limit; 'network': the connection failed or was reset;
 * 'server': 5xx; 'rate-limit': 403/429 with a rate-limit signal (not a permission problem); 'refused': any other
 * 403 (e.g. a read-only token); 'client': any other 4xx (401 bad credentials, 404, 422).
 */
export type ErrorKind = 'timeout' | 'network' | 'server' | 'rate-limit' | 'refused' | 'client';

/** An answer outside 2xx after retries, or a request that never got an answer. */
export class GitHubApiError extends Error {
  constructor(
    readonly method: string,
    readonly path: string,
    /** null: no answer (network error or timeout). */
    readonly status: number | null,
    readonly body: string,
    readonly kind: ErrorKind,
    /** For 'rate-limit': how long GitHub asked to wait, in ms. */
    readonly retryAfterMs: number | null = null,
  ) {
    super(`GitHub API ${method} ${path} failed: ${describe(kind, status, retryAfterMs)}${apiMessage(body)}`);
    this.name = 'GitHubApiError';
  }

  /** True when the request may have been carried out although no success was seen (check before repeating). */
  get maybeDone(): boolean {
    return this.kind === 'timeout' || this.kind === 'network' || this.kind === 'server';
  }
}

export interface RequestOptions {
  /** Whether sending it twice is harmless; by default every method but POST. */
  idempotent?: boolean;
}

export interface GitHubClient {
  request<T>(method: string, path: string, body?: unknown, options?: RequestOptions): Promise<ApiResponse<T>>;
  /** GET every page of a list endpoint (per_page=100) and concatenate the items. */
  paginate<T>(path: string): Promise<T[]>;
  /** The proxy requests go through, for the log; null when none. */
  readonly proxy: string | null;
}

export const DEFAULT_TIMEOUT_MS = 30_000;

export function createClient(options: ClientOptions): GitHubClient {
  const base = new URL(options.baseUrl.replace(/\/+$/, '') + '/');
  const policy: RetryPolicy = { ...DEFAULT_RETRY_POLICY, ...options.retry };
  const sleep = options.sleep ?? ((ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms)));
  const maxPages = options.maxPages ?? 100;
  const timeoutMs = options.timeoutMs ?? DEFAULT_TIMEOUT_MS;
  const transport = options.transport ?? transportFor(base);
  const clean = (text: string): string => redactSecret(text, options.token);

  function resolveUrl(path: string): URL {
    const url = /^https?:\/\//i.test(path) ? new URL(path) : new URL(path.replace(/^\/+/, ''), base);
    if (url.origin !== base.origin)
      throw new Error(`refusing to send the token to another origin: ${url.origin}`);
    return url;
  }

  async function request<T>(
    method: string,
    path: string,
    body?: unknown,
    requestOptions: RequestOptions = {},
  ): Promise<ApiResponse<T>> {
    const url = resolveUrl(path);
    const idempotent = requestOptions.idempotent ?? method.toUpperCase() !== 'POST';
    for (let attempt = 1; ; attempt++) {
      let response: Response | null = null;
      let text = '';
      let kind: ErrorKind = 'network';
      try {
        response = await transport.fetch(url, {
          method,
          headers: {
            accept: 'application/vnd.github+json',
            authorization: `Bearer ${options.token}`,
            'user-agent': 'stereogate-action',
            'x-github-api-version': '2022-11-28',
            ...(body === undefined ? {} : { 'content-type': 'application/json' }),
          },
          ...(body === undefined ? {} : { body: JSON.stringify(body) }),
          signal: AbortSignal.timeout(timeoutMs),
        });
        text = await response.text();
      } catch (error) {
        response = null;
        kind = isTimeout(error) ? 'timeout' : 'network';
        text = kind === 'timeout' ? `no answer within ${timeoutMs / 1000} s` : networkMessage(error);
      }
      if (response !== null && response.status >= 200 && response.status < 300) {
        const data = (text === '' ? null : JSON.parse(text)) as T;
        return { status: response.status, data, headers: response.headers };
      }
      const seen =
        response === null ? null : { status: response.status, headers: response.headers, bodyText: text };
      if (seen !== null) kind = classify(seen);
      const delay = retryDelayMs(seen, attempt, policy, Date.now(), idempotent);
      if (delay === null) {
        const wait = seen === null ? null : rateLimitWaitMs(seen);
        throw new GitHubApiError(method, url.pathname, response?.status ?? null, clean(text), kind, wait);
      }
      options.onRetry?.({
        method,
        path: url.pathname,
        status: response?.status ?? null,
        kind,
        delayMs: delay,
        attempt,
      });
      await sleep(delay);
    }
  }

  async function paginate<T>(path: string): Promise<T[]> {
    const items: T[] = [];
    const first = resolveUrl(path);
    if (!first.searchParams.has('per_page')) first.searchParams.set('per_page', '100');
    let next: string | null = first.toString();
    for (let page = 0; next !== null && page < maxPages; page++) {
      const answer: ApiResponse<T[]> = await request<T[]>('GET', next);
      if (!Array.isArray(answer.data)) throw new Error(`expected a list from ${first.pathname}`);
      items.push(...answer.data);
      next = nextLink(answer.headers.get('link'));
    }
    return items;
  }

  return { request, paginate, proxy: transport.proxy };
}

function classify(answer: { status: number; headers: Headers; bodyText: string }): ErrorKind {
  if (answer.status >= 500) return 'server';
  if (rateLimitWaitMs(answer) !== null) return 'rate-limit';
  if (answer.status === 403) return 'refused';
  return 'client';
}

function isTimeout(error: unknown): boolean {
  return error instanceof Error && (error.name === 'TimeoutError' || error.name === 'AbortError');
}

/** fetch says only "fetch failed"; the cause says what happened (ECONNRESET, "other side closed", …). */
function networkMessage(error: unknown): string {
  if (!(error instanceof Error)) return String(error);
  const cause = (error as Error & { cause?: unknown }).cause;
  if (cause instanceof Error) {
    const code = (cause as Error & { code?: unknown }).code;
    return `${error.message}: ${typeof code === 'string' ? `${code} ` : ''}${cause.message}`;
  }
  return error.message;
}

function describe(kind: ErrorKind, status: number | null, retryAfterMs: number | null): string {
  if (kind === 'timeout') return 'no answer in time';
  if (kind === 'network') return 'the connection failed';
  if (kind === 'rate-limit')
    return (
      `HTTP ${status} rate limit (not a permission problem)` +
      (retryAfterMs === null ? '' : `; GitHub asks to wait ${Math.ceil(retryAfterMs / 1000)} s`)
    );
  return `HTTP ${status}`;
}

/** The rel="next" target of a Link header (RFC 8288), or null. */
export function nextLink(header: string | null): string | null {
  if (header === null) return null;
  for (const part of header.split(',')) {
    const match = /<([^>]+)>\s*;(.*)/.exec(part.trim());
    if (match !== null && /\brel="?next"?/.test(match[2] ?? '')) return match[1] ?? null;
  }
  return null;
}

function apiMessage(body: string): string {
  try {
    const parsed = JSON.parse(body) as { message?: unknown };
    return typeof parsed.message === 'string' ? `: ${parsed.message.slice(0, 200)}` : '';
  } catch {
    return body !== '' && !body.trimStart().startsWith('<') ? `: ${body.slice(0, 200)}` : '';
  }
}
