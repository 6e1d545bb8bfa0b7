/**
 * A loopback HTTP server answering the REST endpoints the action uses, keeping the comments it is sent, and
 * refusing review comments on lines outside the diff with 422, as GitHub does. Listens on 127.0.0.1 only.
 */
import { createServer, type IncomingMessage, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { parsePatch } from '../../../src/github/patch.js';

export interface PrFile {
  filename: string;
  status: string;
  patch?: string;
}

export interface FakeGitHub {
  url: string;
  /** What the fake pull request shows; tests change it between runs. */
  files: PrFile[];
  issueComments: { id: number; body: string; user: { login: string; type: string } }[];
  reviewComments: { id: number; path: string; line: number; body: string; commit_id: string }[];
  requests: { method: string; path: string; authorization: string | undefined }[];
  unexpected: string[];
  close(): Promise<void>;
}

export async function startFakeGitHub(owner: string, repo: string, number: number): Promise<FakeGitHub> {
  let nextId = 1000;
  const base = `/repos/${owner}/${repo}`;
  const state: Omit<FakeGitHub, 'url' | 'close'> = {
    files: [],
    issueComments: [],
    reviewComments: [],
    requests: [],
    unexpected: [],
  };

  const server: Server = createServer((req, res) => {
    void (async () => {
      const url = new URL(req.url ?? '/', 'http://127.0.0.1');
      const method = req.method ?? 'GET';
      state.requests.push({ method, path: url.pathname, authorization: req.headers.authorization });
      const body = await readJson(req);
      const send = (status: number, data: unknown): void => {
        res.writeHead(status, { 'content-type': 'application/json' });
        res.end(JSON.stringify(data));
      };
      const route = `${method} ${url.pathname}`;
      if (route === `GET ${base}/pulls/${number}/files`) return send(200, state.files);
      if (route === `GET ${base}/issues/${number}/comments`) return send(200, state.issueComments);
      if (route === `POST ${base}/issues/${number}/comments`) {
        const comment = {
          id: nextId++,
          body: String(body.body),
          user: { login: 'github-actions[bot]', type: 'Bot' },
        };
        state.issueComments.push(comment);
        return send(201, {
          ...comment,
          html_url: `https://github.test/${owner}/${repo}/pull/${number}#issuecomment-${comment.id}`,
        });
      }
      const patch = /^PATCH \/repos\/[^/]+\/[^/]+\/issues\/comments\/(\d+)$/.exec(route);
      if (patch !== null) {
        const comment = state.issueComments.find((c) => c.id === Number(patch[1]));
        if (comment === undefined) return send(404, { message: 'Not Found' });
        comment.body = String(body.body);
        return send(200, comment);
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
        };
        state.reviewComments.push(comment);
        return send(201, comment);
      }
      state.unexpected.push(route);
      send(404, { message: 'Not Found' });
    })();
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return Object.assign(state, {
    url: `http://127.0.0.1:${port}`,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  });
}

async function readJson(req: IncomingMessage): Promise<Record<string, unknown>> {
  const chunks: Buffer[] = [];
  for await (const chunk of req) chunks.push(chunk as Buffer);
  const text = Buffer.concat(chunks).toString('utf8');
  return text === '' ? {} : (JSON.parse(text) as Record<string, unknown>);
}
