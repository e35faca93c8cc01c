/**
 * The service's entry point: listens (127.0.0.1:5177 unless asked otherwise),
 * prints the URL, and on SIGTERM or SIGINT stops gracefully: no new
 * connections, in-flight requests finish (up to a grace period), the worker
 * pool closes, the process exits. `node dist/server/main.js [--port N]
 * [--host H] [--data DIR]` and `fieldgap serve` run the same code.
 */
import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import { networkInterfaces } from 'node:os';
import { pathToFileURL } from 'node:url';
import type { Logger } from 'pino';
import { FieldgapError, isFieldgapError } from '../src/errors.js';
import { numberOption, parseCommandArgs } from '../src/arguments.js';
import { createApp, type AppOptions, type FieldgapApp } from './app.js';
import { createLogger } from './logging.js';
import { describeLocation, resolveLibraryLocation } from '../src/library/location.js';
import { generateToken, singleTokenResolver } from './security/auth.js';
import { allowedHostsFor, isLoopbackHost, isWildcardHost } from './security/hosts.js';

export const DEFAULT_PORT = 5177;
export const DEFAULT_HOST = '127.0.0.1';

export interface ServeOptions extends Omit<AppOptions, 'logger'> {
  /** TCP port; default 5177; 0 picks a free one. */
  port?: number;
  /** Interface to listen on; default 127.0.0.1 (loopback only). */
  host?: string;
  logger?: Logger;
  /** How long in-flight requests may take to finish on shutdown, ms; default 15 000. */
  shutdownGraceMs?: number;
  /**
   * Access token every request must carry. Default: none on loopback; a new
   * random one when host is beyond loopback (RunningServer.token tells it).
   */
  token?: string;
  /** Host names besides this machine's addresses that requests may use (a DNS name of the machine). */
  allowedHostNames?: readonly string[];
}

export interface RunningServer {
  /** "http://127.0.0.1:5177/"; beyond loopback, an address other machines can use. */
  url: string;
  /** The access token requests must carry, when one is required. */
  token: string | undefined;
  port: number;
  server: Server;
  app: FieldgapApp;
  /** Graceful stop: refuse new connections, finish in-flight requests, close the pool. Idempotent. */
  close(): Promise<void>;
}

function listenError(error: NodeJS.ErrnoException, host: string, port: number): FieldgapError {
  if (error.code === 'EADDRINUSE') return new FieldgapError('invalid-argument', `--port: port ${port} on ${host} is already in use; choose another with --port`, '--port');
  if (error.code === 'EACCES') return new FieldgapError('invalid-argument', `--port: not allowed to listen on port ${port}`, '--port');
  if (error.code === 'EADDRNOTAVAIL' || error.code === 'ENOTFOUND') return new FieldgapError('invalid-argument', `--host: ${host} is not an address of this machine`, '--host');
  return new FieldgapError('internal', `could not listen on ${host}:${port}: ${error.message}`);
}

/** An address other machines can reach this one at: the first external IPv4 address, else loopback. */
function externalAddress(): string {
  for (const list of Object.values(networkInterfaces())) {
    for (const entry of list ?? []) if (entry.family === 'IPv4' && !entry.internal) return entry.address;
  }
  return '127.0.0.1';
}

function formatUrl(host: string, port: number): string {
  const shown = isWildcardHost(host) ? externalAddress() : host.includes(':') ? `[${host}]` : host;
  return `http://${shown}:${port}/`;
}

/** Builds the app and listens; resolves once listening. */
export async function startServer(options: ServeOptions = {}): Promise<RunningServer> {
  const { port = DEFAULT_PORT, host = DEFAULT_HOST, logger = createLogger(), shutdownGraceMs = 15_000, token: givenToken, allowedHostNames = [], ...appOptions } = options;
  const token = givenToken ?? (isLoopbackHost(host) ? undefined : generateToken());
  const app = createApp({
    allowedHosts: allowedHostsFor({ listenHost: host, extra: allowedHostNames }),
    ...(token === undefined ? {} : { identify: singleTokenResolver(token) }),
    // Beyond loopback the library's users (when any are defined) replace the single token.
    identifyUsers: !isLoopbackHost(host),
    ...appOptions,
    logger,
  });
  const server = createServer(app);
  // Slow or stuck clients do not hold a connection forever.
  server.headersTimeout = 20_000;
  server.requestTimeout = 60_000;
  server.keepAliveTimeout = 5_000;
  try {
    await new Promise<void>((resolveListen, rejectListen) => {
      server.once('error', rejectListen);
      server.listen(port, host, () => {
        server.off('error', rejectListen);
        resolveListen();
      });
    });
  } catch (error) {
    await app.close();
    throw listenError(error as NodeJS.ErrnoException, host, port);
  }
  const actualPort = (server.address() as AddressInfo).port;

  let closing: Promise<void> | undefined;
  const close = () => {
    closing ??= (async () => {
      const closed = new Promise<void>((resolveClose) => server.close(() => resolveClose()));
      // A keep-alive connection becomes idle when its in-flight request ends: close it then, not after keepAliveTimeout.
      server.closeIdleConnections();
      const sweep = setInterval(() => server.closeIdleConnections(), 50);
      const grace = setTimeout(() => server.closeAllConnections(), shutdownGraceMs);
      grace.unref();
      await closed;
      clearInterval(sweep);
      clearTimeout(grace);
      await app.close();
    })();
    return closing;
  };
  return { url: formatUrl(host, actualPort), token, port: actualPort, server, app, close };
}

/** What the service says when it starts: the address to open and, beyond loopback, which token each request needs. */
export interface StartupFacts {
  url: string;
  host: string;
  /** The service token, undefined on loopback (no token needed). */
  token: string | undefined;
  /** The token came from --token / FIELDGAP_TOKEN (never echoed). */
  tokenGiven: boolean;
  /** Users defined in the library; undefined when the library could not be asked. */
  users: number | undefined;
}

/**
 * The start lines of `fieldgap serve` (stdout: where it serves; stderr: what
 * a request needs). With users in the library, beyond loopback, the service
 * token is refused, so it is not offered: each user sends their own.
 */
export function startupMessage({ url, host, token, tokenGiven, users }: StartupFacts): { stdout: string; stderr: string } {
  const api = `(API ${url}api/v1, press Ctrl-C to stop)`;
  if (token === undefined) return { stdout: `fieldgap: serving on ${url} ${api}\n`, stderr: '' };
  const beyondLoopback = !isLoopbackHost(host);
  if (beyondLoopback && users !== undefined && users > 0) {
    return {
      stdout: `fieldgap: serving on ${url} (open ${url}?token=YOUR_TOKEN once in the browser) ${api}\n`,
      stderr: `fieldgap: listening on ${host}: ${users} user${users === 1 ? ' is' : 's are'} defined in the library: each request needs its user's own token ("Authorization: Bearer TOKEN"; a new one with fieldgap users token NAME)\n`,
    };
  }
  // A token the user chose is not echoed; a generated one must be, or nobody could use the service.
  const pageUrl = tokenGiven ? `${url} (open ${url}?token=YOUR_TOKEN once in the browser)` : `${url}?token=${token}`;
  let stderr = `fieldgap: listening on ${host}: every request needs the access token${tokenGiven ? '' : ` ${token}`} ("Authorization: Bearer TOKEN" for scripts)\n`;
  if (beyondLoopback) stderr += "fieldgap: once users are defined (fieldgap users add), each request needs its user's own token instead\n";
  return { stdout: `fieldgap: serving on ${pageUrl} ${api}\n`, stderr };
}

export interface ServeIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  cwd: string;
  env: Record<string, string | undefined>;
}

/** Parses the serve options, serves until SIGTERM/SIGINT, then resolves with the exit code. */
export async function runServe(argv: string[], io: ServeIo): Promise<number> {
  const { values } = parseCommandArgs(argv, {
    port: { type: 'string' },
    host: { type: 'string' },
    data: { type: 'string' },
    database: { type: 'string' },
    token: { type: 'string' },
    'allowed-host': { type: 'string', multiple: true },
  });
  const port = numberOption('port', values.port, { min: 0, max: 65_535, integer: true }) ?? DEFAULT_PORT;
  const host = values.host?.trim() || DEFAULT_HOST;
  const location = resolveLibraryLocation({ dataFlag: values.data, databaseFlag: values.database, env: io.env, cwd: io.cwd });
  const givenToken = values.token ?? io.env['FIELDGAP_TOKEN'];
  const allowedHostNames = [...(values['allowed-host'] ?? []), ...(io.env['FIELDGAP_ALLOWED_HOSTS'] ?? '').split(',')].filter((n) => n.trim() !== '');
  const running = await startServer({
    port,
    host,
    ...(location.engine === 'sqlite' ? { dataDir: location.dataDir } : { database: location.url }),
    allowedHostNames,
    ...(givenToken ? { token: givenToken } : {}),
  });
  // Beyond loopback, users in the library replace the service token: say so rather than print a token that is refused.
  const users = running.token === undefined || isLoopbackHost(host) ? 0 : await running.app.library.users.count().catch(() => undefined);
  const start = startupMessage({ url: running.url, host, token: running.token, tokenGiven: givenToken !== undefined && givenToken !== '', users });
  io.stdout(start.stdout);
  io.stderr(start.stderr);
  // The library opens on first use; say now if it cannot, but serve anyway: it is retried on each request.
  await running.app.library.ping().then(
    () => io.stdout(`fieldgap: library: ${describeLocation(location)}${running.app.library.readOnly ? ' (read-only)' : ''}\n`),
    (error: unknown) => io.stderr(`fieldgap: library not available yet (${isFieldgapError(error) ? error.message : 'could not be opened'}); retried on each request\n`),
  );

  await new Promise<void>((resolveStop) => {
    const stop = (signal: NodeJS.Signals) => {
      io.stderr(`fieldgap: ${signal}: finishing requests in progress, then stopping\n`);
      process.off('SIGTERM', stop);
      process.off('SIGINT', stop);
      // A second Ctrl-C while draining ends at once.
      process.once('SIGINT', () => running.server.closeAllConnections());
      void running.close().then(resolveStop, resolveStop);
    };
    process.on('SIGTERM', stop);
    process.on('SIGINT', stop);
  });
  io.stderr('fieldgap: stopped\n');
  return 0;
}

/** `node dist/server/main.js [options]`: same as `fieldgap serve`. */
async function main(): Promise<void> {
  const io: ServeIo = {
    stdout: (text) => process.stdout.write(text),
    stderr: (text) => process.stderr.write(text),
    cwd: process.cwd(),
    env: process.env,
  };
  try {
    process.exitCode = await runServe(process.argv.slice(2), io);
  } catch (error) {
    const message = isFieldgapError(error) ? error.message : `internal error: ${(error as Error)?.message ?? String(error)}`;
    io.stderr(`fieldgap serve: ${message}\n`);
    process.exitCode = 2;
  }
}

const entry = process.argv[1];
if (entry !== undefined && import.meta.url === pathToFileURL(entry).href) await main();
