/**
 * A small HTTP CONNECT proxy on 127.0.0.1, standing in for a corporate proxy in front of a self-hosted runner. It
 * tunnels every CONNECT to one loopback port (the fake GitHub), whatever host was asked for — so a request that
 * names a host no resolver knows can only arrive through it — and records what it was asked to connect to.
 */
import { createServer, type Server } from 'node:http';
import { connect, type AddressInfo, type Socket } from 'node:net';

export interface ConnectProxy {
  url: string;
  /** The `host:port` of every CONNECT, in order. */
  connects: string[];
  close(): Promise<void>;
}

export async function startConnectProxy(targetPort: number): Promise<ConnectProxy> {
  const connects: string[] = [];
  const sockets = new Set<Socket>();
  const server: Server = createServer((_req, res) => {
    res.writeHead(405);
    res.end('CONNECT only');
  });
  server.on('connect', (req, client: Socket, head: Buffer) => {
    connects.push(req.url ?? '');
    const upstream = connect(targetPort, '127.0.0.1', () => {
      client.write('HTTP/1.1 200 Connection Established\r\n\r\n');
      if (head.length > 0) upstream.write(head);
      upstream.pipe(client);
      client.pipe(upstream);
    });
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on('close', () => sockets.delete(s));
      s.on('error', () => {
        client.destroy();
        upstream.destroy();
      });
    }
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    connects,
    close: () =>
      new Promise<void>((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}
