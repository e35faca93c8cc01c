/**
 * Cross-site writes. A web page the user visits may send "simple" requests
 * (a form POST, a text/plain body, a bodiless POST) to any address without a
 * preflight; the browser marks them with Origin and Sec-Fetch-Site. A
 * state-changing request that a browser marks as coming from another site is
 * refused (403), and one from this server's own page must also carry
 * WRITE_HEADER, which a foreign page cannot add without a CORS preflight this
 * service never approves. Scripts (curl, instrument software) send neither
 * mark and keep working as before; off loopback they need the access token.
 */
import type { NextFunction, Request, Response } from 'express';
import { FieldgapError } from '../../src/errors.js';
import { hostNameOf } from './hosts.js';

/** The header the page sends with every write (any value): not a CORS-safelisted header. */
export const WRITE_HEADER = 'X-Fieldgap-Request';

const READ_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** True when origin ("http://127.0.0.1:5177") names the same host and port as the Host header. */
export function isSameOrigin(origin: string, host: string | undefined): boolean {
  if (host === undefined) return false;
  let url: URL;
  try {
    url = new URL(origin);
  } catch {
    return false; // "null" (sandboxed frames, file:// pages) and garbage
  }
  if (url.protocol !== 'http:' && url.protocol !== 'https:') return false;
  const defaultPort = url.protocol === 'https:' ? '443' : '80';
  const originPort = url.port === '' ? defaultPort : url.port;
  const hostPort = /:(\d{1,5})$/.exec(host.trim())?.[1] ?? '80';
  return hostNameOf(url.host) === hostNameOf(host) && originPort === hostPort;
}

function refuse(message: string, path: string): FieldgapError {
  return new FieldgapError('forbidden', message, path);
}

/** The middleware: lets reads through; checks Origin, Sec-Fetch-Site and WRITE_HEADER on writes from a browser. */
export function originGuard() {
  return (req: Request, _res: Response, next: NextFunction): void => {
    if (READ_METHODS.has(req.method)) return next();
    const origin = req.headers.origin;
    const site = req.headers['sec-fetch-site'];
    if (origin === undefined && site === undefined) return next();
    if (origin !== undefined && !isSameOrigin(origin, req.headers.host)) {
      return next(refuse(`Origin: ${JSON.stringify(origin.slice(0, 80))} is another web site; fieldgap accepts changes only from its own page or from scripts`, 'Origin'));
    }
    if (site !== undefined && site !== 'same-origin' && site !== 'none') {
      return next(refuse(`Sec-Fetch-Site: a ${String(site)} request may not change anything; fieldgap accepts changes only from its own page or from scripts`, 'Sec-Fetch-Site'));
    }
    if (req.get(WRITE_HEADER) === undefined) {
      return next(refuse(`${WRITE_HEADER}: a change sent from a web page must carry this header (fieldgap's own page sends it)`, WRITE_HEADER));
    }
    next();
  };
}
