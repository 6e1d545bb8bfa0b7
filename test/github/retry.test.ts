import { describe, expect, it } from 'vitest';
import { isRateLimit, retryDelayMs } from '../../src/github/retry.js';

const headers = (h: Record<string, string>) => new Headers(h);
const policy = { maxTries: 3, baseDelayMs: 100, maxDelayMs: 10_000 };

describe('retryDelayMs', () => {
  it('backs off 5xx answers, doubling, and stops after maxTries', () => {
    const answer = { status: 502, headers: headers({}), bodyText: '' };
    expect(retryDelayMs(answer, 1, policy)).toBe(100);
    expect(retryDelayMs(answer, 2, policy)).toBe(200);
    expect(retryDelayMs(answer, 3, policy)).toBeNull();
  });

  it('retries a network failure like a 5xx', () => {
    expect(retryDelayMs(null, 1, policy)).toBe(100);
  });

  // GitHub REST docs, "Rate limits for the REST API": on a secondary limit wait Retry-After seconds.
  it('honours Retry-After seconds on a secondary rate limit (403 and 429)', () => {
    const body = JSON.stringify({ message: 'You have exceeded a secondary rate limit.' });
    expect(
      retryDelayMs({ status: 403, headers: headers({ 'retry-after': '3' }), bodyText: body }, 1, policy),
    ).toBe(3000);
    expect(
      retryDelayMs({ status: 429, headers: headers({ 'retry-after': '2' }), bodyText: '' }, 1, policy),
    ).toBe(2000);
  });

  // RFC 9110 §10.2.3: Retry-After may be an HTTP date.
  it('reads Retry-After given as an HTTP date', () => {
    const now = Date.parse('2026-01-01T00:00:00Z');
    const answer = {
      status: 429,
      headers: headers({ 'retry-after': 'Thu, 01 Jan 2026 00:00:05 GMT' }),
      bodyText: '',
    };
    expect(retryDelayMs(answer, 1, policy, now)).toBe(5000);
  });

  // Same GitHub doc: with x-ratelimit-remaining 0, wait until x-ratelimit-reset (epoch seconds).
  it('waits until x-ratelimit-reset when the primary limit is used up', () => {
    const now = 1_000_000_000_000;
    const answer = {
      status: 403,
      headers: headers({ 'x-ratelimit-remaining': '0', 'x-ratelimit-reset': String(now / 1000 + 4) }),
      bodyText: '',
    };
    expect(retryDelayMs(answer, 1, policy, now)).toBe(5000);
  });

  it('gives up on a wait longer than the policy allows', () => {
    const answer = { status: 429, headers: headers({ 'retry-after': '3600' }), bodyText: '' };
    expect(retryDelayMs(answer, 1, policy)).toBeNull();
  });

  it('does not retry a plain permission refusal or a validation error', () => {
    const forbidden = {
      status: 403,
      headers: headers({}),
      bodyText: '{"message":"Resource not accessible by integration"}',
    };
    expect(isRateLimit(forbidden)).toBe(false);
    expect(retryDelayMs(forbidden, 1, policy)).toBeNull();
    expect(retryDelayMs({ status: 422, headers: headers({}), bodyText: '' }, 1, policy)).toBeNull();
    expect(retryDelayMs({ status: 404, headers: headers({}), bodyText: '' }, 1, policy)).toBeNull();
  });

  // Issue 10: a creation whose outcome is unknown is not repeated by the client (the caller looks first); a rate-limit
  // refusal is, since GitHub did not act on it.
  it('does not retry a non-idempotent request after a 5xx or no answer, but does after a short rate limit', () => {
    const p = { ...policy };
    expect(
      retryDelayMs({ status: 502, headers: headers({}), bodyText: '' }, 1, p, Date.now(), false),
    ).toBeNull();
    expect(retryDelayMs(null, 1, p, Date.now(), false)).toBeNull();
    expect(
      retryDelayMs(
        { status: 429, headers: headers({ 'retry-after': '1' }), bodyText: '' },
        1,
        p,
        Date.now(),
        false,
      ),
    ).toBe(1000);
  });
});
