/**
 * The DNS-rebinding guard. A web page on rebind.example can make its own name
 * resolve to 127.0.0.1; the browser then sends the page's requests to this
 * service with `Host: rebind.example:5177` and lets the page read the
 * answers. Requests whose Host is not a name or address of this server are
 * therefore refused (403) before any route runs.
 */
import { hostname as osHostname, networkInterfaces } from 'node:os';
import type { NextFunction, Request, Response } from 'express';
import { FieldgapError } from '../../src/errors.js';

/** Names a request to a loopback-bound service may carry: no DNS server can point them elsewhere. */
export const LOOPBACK_HOSTS: readonly string[] = ['localhost', '127.0.0.1', '::1'];

/** True for an address that only this machine reaches (127.0.0.0/8, ::1, localhost). */
export function isLoopbackHost(host: string): boolean {
  const h = host.trim().toLowerCase().replace(/^\[(.*)\]$/, '$1');
  return h === 'localhost' || h === '::1' || /^127(\.\d{1,3}){3}$/.test(h) || h === '::ffff:127.0.0.1';
}

/** True for the "every interface" addresses (0.0.0.0, ::). */
export function isWildcardHost(host: string): boolean {
  const h = host.trim().replace(/^\[(.*)\]$/, '$1');
  return h === '0.0.0.0' || h === '::' || h === '';
}

/**
 * The host name of a Host header, lower case, without port or IPv6 brackets:
 * "Example.org:5177" → "example.org", "[::1]:5177" → "::1"; undefined when
 * the header is missing or malformed.
 */
export function hostNameOf(header: string | undefined): string | undefined {
  if (header === undefined) return undefined;
  const h = header.trim().toLowerCase();
  const bracketed = /^\[([0-9a-f:.]+)\](?::\d{1,5})?$/.exec(h);
  if (bracketed) return bracketed[1];
  const plain = /^([a-z0-9.-]+)(?::\d{1,5})?$/.exec(h);
  return plain ? plain[1] : undefined;
}

export interface AllowedHostsInput {
  /** The address the server listens on (--host). */
  listenHost: string;
  /** Names the user allowed besides (--allowed-host, FIELDGAP_ALLOWED_HOSTS). */
  extra?: readonly string[];
  /** This machine's interface addresses; default os.networkInterfaces(). */
  interfaces?: ReturnType<typeof networkInterfaces>;
  /** This machine's name; default os.hostname(). */
  hostname?: string;
}

/**
 * The Host names a server bound to listenHost answers: the loopback names,
 * the bound address, for a wildcard bind every interface address and the
 * machine's name, and the names the user added.
 */
export function allowedHostsFor({ listenHost, extra = [], interfaces = networkInterfaces(), hostname = osHostname() }: AllowedHostsInput): string[] {
  const out = new Set<string>(LOOPBACK_HOSTS);
  const add = (name: string) => {
    const n = hostNameOf(name.includes(':') && !name.startsWith('[') ? `[${name}]` : name);
    if (n !== undefined) out.add(n);
  };
  if (isWildcardHost(listenHost)) {
    for (const list of Object.values(interfaces)) for (const entry of list ?? []) add(entry.address);
    if (hostname !== '') {
      add(hostname);
      add(`${hostname}.local`);
    }
  } else {
    add(listenHost);
  }
  for (const name of extra) if (name.trim() !== '') add(name.trim());
  return [...out];
}

/** The middleware: 403 for a request whose Host header is not one of `allowed` (see allowedHostsFor). */
export function hostGuard(allowed: readonly string[]) {
  const names = new Set(allowed.map((a) => a.toLowerCase()));
  return (req: Request, _res: Response, next: NextFunction): void => {
    const name = hostNameOf(req.headers.host);
    if (name !== undefined && names.has(name)) {
      next();
      return;
    }
    const shown = JSON.stringify((req.headers.host ?? '').slice(0, 80));
    next(
      new FieldgapError(
        'forbidden',
        `Host: ${req.headers.host === undefined ? 'missing' : shown} is not a name of this fieldgap server; open it by its address (or start it with --allowed-host NAME)`,
        'Host',
      ),
    );
  };
}
