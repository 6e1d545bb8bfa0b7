/**
 * How a request reaches GitHub: straight out, or through the proxy the runner names. Self-hosted runners behind a
 * corporate proxy set `HTTPS_PROXY`/`https_proxy` (and `HTTP_PROXY` for plain-http API URLs) with `NO_PROXY`
 * exceptions; the Actions toolkit's own rules decide (@actions/http-client's getProxyUrl: lower-case variable
 * first, `NO_PROXY` host and host:port suffixes, `*`, loopback never proxied), so stereogate behaves exactly like
 * the first-party actions on the same runner. Through a proxy the request is tunnelled with HTTP CONNECT by
 * undici's ProxyAgent, with undici's own fetch so agent and fetch are one version on Node 20 and 24.
 */
import { getProxyUrl } from '@actions/http-client/lib/proxy';
import { fetch as undiciFetch, ProxyAgent, type Dispatcher } from 'undici';

export interface Transport {
  /** The proxy used, without credentials, for the log; null when requests go straight out. */
  proxy: string | null;
  fetch(url: URL, init: FetchInit): Promise<Response>;
}

export interface FetchInit {
  method: string;
  headers: Record<string, string>;
  body?: string;
  signal: AbortSignal;
}

export interface TransportOptions {
  /** Extra trusted certificate authorities (PEM) for TLS to the API and the proxy; tests use a self-signed one. */
  ca?: string;
}

/** The transport for requests to `baseUrl`, from the proxy variables in the environment at call time. */
export function transportFor(baseUrl: URL, options: TransportOptions = {}): Transport {
  const proxyUrl = getProxyUrl(baseUrl);
  if (proxyUrl === undefined) {
    return { proxy: null, fetch: (url, init) => globalThis.fetch(url, init) };
  }
  const token =
    proxyUrl.username !== '' || proxyUrl.password !== ''
      ? `Basic ${Buffer.from(`${proxyUrl.username}:${proxyUrl.password}`).toString('base64')}`
      : undefined;
  const agent: Dispatcher = new ProxyAgent({
    uri: `${proxyUrl.protocol}//${proxyUrl.host}`,
    ...(token === undefined ? {} : { token }),
    ...(options.ca === undefined ? {} : { requestTls: { ca: options.ca }, proxyTls: { ca: options.ca } }),
  });
  return {
    proxy: `${proxyUrl.protocol}//${proxyUrl.host}`,
    fetch: async (url, init) =>
      (await undiciFetch(url, { ...init, dispatcher: agent })) as unknown as Response,
  };
}
