/**
 * A TCP proxy a test can cut: the service reaches PostgreSQL through it, and
 * cut() drops every connection and refuses new ones, as a network or server
 * outage would; restore() lets connections through again.
 */
import { connect, createServer, type Server, type Socket } from 'node:net';
import type { TestLibrary } from './engines.js';

export interface CutProxy {
  port: number;
  cut(): void;
  restore(): void;
  close(): Promise<void>;
}

export async function startCutProxy(targetPort: number, targetHost: string): Promise<CutProxy> {
  let down = false;
  const sockets = new Set<Socket>();
  const server: Server = createServer((client) => {
    if (down) {
      client.destroy();
      return;
    }
    const upstream = connect(targetPort, targetHost);
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on('close', () => sockets.delete(s));
      s.on('error', () => undefined);
    }
    client.pipe(upstream).pipe(client);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return {
    port: (server.address() as { port: number }).port,
    cut: () => {
      down = true;
      for (const s of sockets) s.destroy();
    },
    restore: () => {
      down = false;
    },
    close: async () => {
      for (const s of sockets) s.destroy();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/**
 * A fresh PostgreSQL test library reached through a new cut proxy: the proxy
 * (to cut, restore and close) and the library's URL pointed at it; undefined
 * for any other engine.
 */
export async function throughCutProxy(location: TestLibrary['location']): Promise<{ proxy: CutProxy; url: URL } | undefined> {
  if (location.engine !== 'postgres') return undefined;
  const url = new URL(location.url);
  const proxy = await startCutProxy(Number(url.port), url.hostname);
  url.port = String(proxy.port);
  return { proxy, url };
}
