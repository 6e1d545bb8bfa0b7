/**
 * A loopback HTTP(S) server answering the REST endpoints the action uses, keeping the comments it is sent, and
 * refusing review comments on lines outside the diff with 422, as GitHub does. Listens on 127.0.0.1 only.
 *
 * Faults make it behave like a real, imperfect GitHub: a 5xx or a dropped connection after the comment was
 * created, a request that never gets an answer, a rate limit with a long Retry-After, an error message that echoes
 * the token, and a slow creation (so two overlapping runs both create). Each fault applies to the next matching
 * requests, `times` times.
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { createServer as createTlsServer } from 'node:https';
import type { AddressInfo, Socket } from 'node:net';
import { parsePatch } from '../../../src/github/patch.js';

export interface PrFile {
  filename: string;
  status: string;
  patch?: string;
}

export type FaultKind =
  /** Create, then answer 502. */
  | 'status-after-create'
  /** Create, then drop the connection without an answer. */
  | 'reset-after-create'
  /** Never answer and create nothing. */
  | 'stall'
  /** Create, then never answer. */
  | 'stall-after-create'
  /** Answer 403 with Retry-After `retryAfter` seconds (a secondary rate limit), create nothing. */
  | 'rate-limit'
  /** Answer 401 with a message quoting the Authorization header, as a careless proxy or server might. */
  | 'echo-token'
  /** Create, then answer only after `delayMs`. */
  | 'slow-create'
  /** Hold the answer until `times` requests have arrived (or 5 s passed): overlapping runs see the same list. */
  | 'barrier';

export interface Fault {
  /** e.g. 'POST /issues/7/comments' or 'POST /pulls/7/comments' or 'GET /pulls/7/files' (after /repos/o/r). */
  route: string;
  kind: FaultKind;
  times?: number;
  retryAfter?: number;
  delayMs?: number;
}

const barriers = new WeakMap<Fault, { size: number; waiting: (() => void)[] }>();

/** Waits at the fault's barrier until as many requests as it was set for have arrived. */
function atBarrier(fault: Fault): Promise<void> {
  const b = barriers.get(fault)!; // set when the fault was first taken, before `times` counts down
  return new Promise<void>((resolve) => {
    b.waiting.push(resolve);
    if (b.waiting.length >= b.size) for (const go of b.waiting.splice(0)) go();
    else setTimeout(resolve, 5000).unref();
  });
}

type User = { login: string; type: string };
const BOT: User = { login: 'github-actions[bot]', type: 'Bot' };

export interface FakeGitHub {
  url: string;
  /** What the fake pull request shows; tests change it between runs. */
  files: PrFile[];
  issueComments: { id: number; body: string; user: User; html_url?: string }[];
  reviewComments: { id: number; path: string; line: number; body: string; commit_id: string; user: User }[];
  requests: { method: string; path: string; authorization: string | undefined }[];
  unexpected: string[];
  faults: Fault[];
  /**
   * null (default): the token is an Actions token, comments come from github-actions[bot] and GET /user is refused
   * as GitHub refuses it for integration tokens; a login: a personal access token of that person.
   */
  tokenUser: string | null;
  /** Plants a comment as a person would (not a bot). */
  plant(body: string, user?: User): void;
  close(): Promise<void>;
}

export interface FakeOptions {
  /** Serve HTTPS with this key and certificate (PEM). */
  tls?: { key: string; cert: string };
}

export async function startFakeGitHub(
  owner: string,
  repo: string,
  number: number,
  options: FakeOptions = {},
): Promise<FakeGitHub> {
  let nextId = 1000;
  const base = `/repos/${owner}/${repo}`;
  const sockets = new Set<Socket>();
  const state: Omit<FakeGitHub, 'url' | 'close' | 'plant'> = {
    files: [],
    issueComments: [],
    reviewComments: [],
    requests: [],
    unexpected: [],
    faults: [],
    tokenUser: null,
  };
  const author = (): User => (state.tokenUser === null ? BOT : { login: state.tokenUser, type: 'User' });

  const takeFault = (route: string): Fault | null => {
    const at = state.faults.findIndex((f) => {
      const [m, p] = f.route.split(' ');
      return route === `${m} ${base}${p}`;
    });
    if (at < 0) return null;
    const fault = state.faults[at]!;
    if (fault.kind === 'barrier' && !barriers.has(fault)) {
      barriers.set(fault, { size: fault.times ?? 1, waiting: [] });
    }
    fault.times = (fault.times ?? 1) - 1;
    if (fault.times <= 0) state.faults.splice(at, 1);
    return fault;
  };

  const handler = (req: IncomingMessage, res: ServerResponse): void => {
    void (async () => {
      const url = new URL(req.url ?? '/', 'http://127.0.0.1');
      const method = req.method ?? 'GET';
      state.requests.push({ method, path: url.pathname, authorization: req.headers.authorization });
      const body = await readJson(req);
      const send = (status: number, data: unknown, headers: Record<string, string> = {}): void => {
        res.writeHead(status, { 'content-type': 'application/json', ...headers });
        res.end(JSON.stringify(data));
      };
      const route = `${method} ${url.pathname}`;
      const fault = takeFault(route);
      if (fault?.kind === 'stall') return; // never answers
      if (fault?.kind === 'barrier') await atBarrier(fault);
      if (fault?.kind === 'rate-limit') {
        return send(
          403,
          {
            message:
              'You have exceeded a secondary rate limit. Please wait a few minutes before you try again.',
          },
          { 'retry-after': String(fault.retryAfter ?? 3600) },
        );
      }
      if (fault?.kind === 'echo-token') {
        return send(401, { message: `Bad credentials: ${req.headers.authorization ?? ''}` });
      }
      /** Answers a creation as the fault says: normally, 502, dropped, never, or late. */
      const created = async (data: unknown): Promise<void> => {
        if (fault?.kind === 'status-after-create') return send(502, { message: 'Server Error' });
        if (fault?.kind === 'reset-after-create') return void req.socket.destroy();
        if (fault?.kind === 'stall-after-create') return;
        if (fault?.kind === 'slow-create') await new Promise((r) => setTimeout(r, fault.delayMs ?? 300));
        send(201, data);
      };

      if (route === 'GET /user') {
        return state.tokenUser === null
          ? send(403, { message: 'Resource not accessible by integration' })
          : send(200, { login: state.tokenUser, type: 'User' });
      }
      if (route === `GET ${base}/pulls/${number}/files`) return send(200, state.files);
      if (route === `GET ${base}/issues/${number}/comments`) return send(200, state.issueComments);
      if (route === `POST ${base}/issues/${number}/comments`) {
        const id = nextId++;
        const comment = {
          id,
          body: String(body.body),
          user: author(),
          html_url: `https://github.test/${owner}/${repo}/pull/${number}#issuecomment-${id}`,
        };
        state.issueComments.push(comment);
        return created(comment);
      }
      const issueComment = /^(PATCH|DELETE) \/repos\/[^/]+\/[^/]+\/issues\/comments\/(\d+)$/.exec(route);
      if (issueComment !== null) {
        const at = state.issueComments.findIndex((c) => c.id === Number(issueComment[2]));
        if (at < 0) return send(404, { message: 'Not Found' });
        if (issueComment[1] === 'DELETE') {
          state.issueComments.splice(at, 1);
          res.writeHead(204);
          return void res.end();
        }
        state.issueComments[at]!.body = String(body.body);
        return send(200, state.issueComments[at]);
      }
      const reviewComment = /^DELETE \/repos\/[^/]+\/[^/]+\/pulls\/comments\/(\d+)$/.exec(route);
      if (reviewComment !== null) {
        const at = state.reviewComments.findIndex((c) => c.id === Number(reviewComment[1]));
        if (at < 0) return send(404, { message: 'Not Found' });
        state.reviewComments.splice(at, 1);
        res.writeHead(204);
        return void res.end();
      }
      if (route === `GET ${base}/pulls/${number}/comments`) return send(200, state.reviewComments);
      if (route === `POST ${base}/pulls/${number}/comments`) {
        const file = state.files.find((f) => f.filename === body.path);
        const line = Number(body.line);
        if (
          file?.patch === undefined ||
          !parsePatch(file.patch).commentable.has(line) ||
          body.side !== 'RIGHT'
        ) {
          return send(422, {
            message: 'Validation Failed',
            errors: [{ message: 'line must be part of the diff' }],
          });
        }
        const comment = {
          id: nextId++,
          path: String(body.path),
          line,
          body: String(body.body),
          commit_id: String(body.commit_id),
          user: author(),
        };
        state.reviewComments.push(comment);
        return created(comment);
      }
      state.unexpected.push(route);
      send(404, { message: 'Not Found' });
    })();
  };
  const server: Server =
    options.tls === undefined ? createServer(handler) : createTlsServer(options.tls, handler);
  server.on('connection', (socket: Socket) => {
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return Object.assign(state, {
    url: `${options.tls === undefined ? 'http' : 'https'}://127.0.0.1:${port}`,
    plant(body: string, user: User = { login: 'mallory', type: 'User' }) {
      state.issueComments.push({ id: nextId++, body, user });
    },
    close: () =>
      new Promise<void>((resolve) => {
        for (const socket of sockets) socket.destroy(); // stalled requests hold their sockets open
        server.close(() => resolve());
      }),
  });
}

async function readJson(req: IncomingMessage): Promise<Record<string, unknown>> {
  const chunks: Buffer[] = [];
  for await (const chunk of req) chunks.push(chunk as Buffer);
  const text = Buffer.concat(chunks).toString('utf8');
  return text === '' ? {} : (JSON.parse(text) as Record<string, unknown>);
}
