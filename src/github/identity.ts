/**
 * Which comments are ours. The workflow token and GitHub App tokens write as a bot (user type "Bot"), and only a
 * bot's comment is ever taken for ours: anyone can paste the hidden marker into a comment of their own. A personal
 * access token writes as its person; then the token's own login (GET /user, which answers only for such tokens)
 * counts too, so a run with a personal token still finds the comments it wrote before.
 */
import type { GitHubClient } from './client.js';

export interface Author {
  login?: string;
  type?: string;
}

const logins = new WeakMap<GitHubClient, Promise<string | null>>();

/** The login the token writes as, when GitHub tells (personal tokens); null otherwise. Asked once per client. */
export function tokenLogin(client: GitHubClient): Promise<string | null> {
  let known = logins.get(client);
  if (known === undefined) {
    known = client
      .request<{ login?: unknown }>('GET', '/user')
      .then((answer) => (typeof answer.data?.login === 'string' ? answer.data.login : null))
      .catch(() => null);
    logins.set(client, known);
  }
  return known;
}

/**
 * A predicate for "written by us" over the given authors: bots always; a person only when the token is theirs
 * (asked only when a person's comment is among the candidates).
 */
export async function isOursFor(
  client: GitHubClient,
  authors: readonly (Author | null | undefined)[],
): Promise<(author: Author | null | undefined) => boolean> {
  const needSelf = authors.some((a) => a?.type !== 'Bot' && typeof a?.login === 'string');
  const self = needSelf ? await tokenLogin(client) : null;
  return (author) => author?.type === 'Bot' || (self !== null && author?.login === self);
}
