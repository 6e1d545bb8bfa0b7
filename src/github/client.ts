/**
 * A small GitHub REST client over fetch: JSON in and out, Link-header pagination, bounded retries for 5xx answers
 * and rate limits. The token is only ever sent to the configured API origin.
 */
import { DEFAULT_RETRY_POLICY, retryDelayMs, type RetryPolicy } from './retry.js';

export interface ClientOptions {
  /** e.g. https://api.github.com or https://ghe.example/api/v3 (GITHUB_API_URL). */
  baseUrl: string;
  token: string;
  retry?: Partial<RetryPolicy>;
  /** Injected so tests need not wait; defaults to setTimeout. */
  sleep?: (ms: number) => Promise<void>;
  /** Told about each retry (the action logs it). */
  onRetry?: (info: {
    method: string;
    path: string;
    status: number | null;
    delayMs: number;
    attempt: number;
  }) => void;
  /** Largest number of pages `paginate` follows (a guard against a server that never stops). */
  maxPages?: number;
}

export interface ApiResponse<T> {
  status: number;
  data: T;
  headers: Headers;
}

/** An answer outside 2xx after retries, or a request that never got an answer. */
export class GitHubApiError extends Error {
  constructor(
    readonly method: string,
    readonly path: string,
    /** null: no answer (network error). */
    readonly status: number | null,
    readonly body: string,
  ) {
    super(
      `GitHub API ${method} ${path} failed: ${status === null ? 'no answer' : `HTTP ${status}`}${apiMessage(body)}`,
    );
    this.name = 'GitHubApiError';
  }
}

export interface GitHubClient {
  request<T>(method: string, path: string, body?: unknown): Promise<ApiResponse<T>>;
  /** GET every page of a list endpoint (per_page=100) and concatenate the items. */
  paginate<T>(path: string): Promise<T[]>;
}

export function createClient(options: ClientOptions): GitHubClient {
  const base = new URL(options.baseUrl.replace(/\/+$/, '') + '/');
  const policy: RetryPolicy = { ...DEFAULT_RETRY_POLICY, ...options.retry };
  const sleep = options.sleep ?? ((ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms)));
  const maxPages = options.maxPages ?? 100;

  function resolveUrl(path: string): URL {
    const url = /^https?:\/\//i.test(path) ? new URL(path) : new URL(path.replace(/^\/+/, ''), base);
    if (url.origin !== base.origin)
      throw new Error(`refusing to send the token to another origin: ${url.origin}`);
    return url;
  }

  async function request<T>(method: string, path: string, body?: unknown): Promise<ApiResponse<T>> {
    const url = resolveUrl(path);
    for (let attempt = 1; ; attempt++) {
      let response: Response | null = null;
      let text = '';
      try {
        response = await fetch(url, {
          method,
          headers: {
            accept: 'application/vnd.github+json',
            authorization: `Bearer ${options.token}`,
            'user-agent': 'stereogate-action',
            'x-github-api-version': '2022-11-28',
            ...(body === undefined ? {} : { 'content-type': 'application/json' }),
          },
          body: body === undefined ? undefined : JSON.stringify(body),
        });
        text = await response.text();
      } catch (error) {
        response = null;
        text = error instanceof Error ? error.message : String(error);
      }
      if (response !== null && response.status >= 200 && response.status < 300) {
        const data = (text === '' ? null : JSON.parse(text)) as T;
        return { status: response.status, data, headers: response.headers };
      }
      const seen =
        response === null ? null : { status: response.status, headers: response.headers, bodyText: text };
      const delay = retryDelayMs(seen, attempt, policy);
      if (delay === null) throw new GitHubApiError(method, url.pathname, response?.status ?? null, text);
      options.onRetry?.({
        method,
        path: url.pathname,
        status: response?.status ?? null,
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

  return { request, paginate };
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
    return '';
  }
}
