/**
 * createApp: the fieldgap REST service as an Express 5 app, built without
 * listening (server/main.ts listens; tests run supertest against the app).
 *
 * Routes, all JSON, energies in cm-1:
 *   GET  /api/v1/health       { status: "ok", version, uptime, pool, library: { engine, reachable } }
 *   GET  /api/v1/openapi.json the OpenAPI 3.1 document
 *   GET  /api/v1/levels       levels of d^n for Dq, B, C
 *   GET  /api/v1/diagram      a Tanabe–Sugano diagram
 *   POST /api/v1/fit          fit band maxima
 *   POST /api/v1/analyze      analyse an uploaded spectrum
 *   /api/v1/analyses, /api/v1 (series): the results library (its own routers)
 *   /                         the web page (static files of staticDir)
 */
import { existsSync } from 'node:fs';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import { errorHandler, notFoundHandler } from './error-handler.js';
import { jsonDepthGuard } from './json-depth.js';
import { createLogger, requestLogger } from './logging.js';
import { buildOpenApiDocument } from './openapi.js';
import { defaultStaticDir, packageVersion } from './paths.js';
import { createInProcessPool, createWorkerPool, type ComputePool } from './pool.js';
import { createAnalysesRouter } from './routes/analyses.js';
import { analyzeInPool, createAnalyzeRouter, spectraInPool } from './routes/analyze.js';
import { createComputeRouter } from './routes/compute.js';
import { createSeriesRouter } from './routes/series.js';
import { lazyLibrary } from '../src/library/lazy.js';
import { openLibraryAt, type Library, type LibraryLocation } from '../src/library/library.js';
import { resolveLibraryLocation } from '../src/library/location.js';
import { authenticate, usersResolver, type IdentityResolver } from './security/auth.js';
import { healthHandler } from './routes/health.js';
import { declaredLengthGuard } from './security/declared-length.js';
import { hostGuard, LOOPBACK_HOSTS } from './security/hosts.js';
import { originGuard } from './security/origin.js';

export const MIB = 1024 * 1024;
/** Room for a multipart form's boundaries and text fields around an upload of the largest size. */
const MULTIPART_OVERHEAD_BYTES = 256 * 1024;

export interface AppOptions {
  /**
   * Where computations run: a ComputePool you own (you close it), "workers"
   * (default: a worker-thread pool the app owns and app.close() stops), or
   * "in-process" (on the event loop, no time limit: for tests).
   */
  pool?: ComputePool | 'workers' | 'in-process';
  /** Time limit of one computation, ms; default 10 000. Over it: 504. */
  requestTimeoutMs?: number;
  /** Largest spectrum upload, bytes; default 10 MiB (10 485 760). Over it: 413. */
  maxBodyBytes?: number;
  /** Largest JSON body, bytes; default 1 MiB. Over it: 413. */
  maxJsonBytes?: number;
  /** pino logger for the request lines and errors; default JSON lines on stdout at "info". */
  logger?: Logger;
  /** Folder of the web page served at /; default server/public (found from source or dist); false: no page. */
  staticDir?: string | false;
  /** Folder of the results library; default $FIELDGAP_DATA, else ./fieldgap-data. */
  dataDir?: string;
  /**
   * A PostgreSQL library (postgres://…) instead of the data folder; default
   * $FIELDGAP_DATABASE_URL when dataDir is not given. Several instances may share one.
   */
  database?: string;
  /**
   * Host names (or addresses) requests may carry in their Host header; others
   * are refused (403) before any route (DNS rebinding). Default: the loopback
   * names (see security/hosts.ts allowedHostsFor for a server beyond loopback).
   */
  allowedHosts?: readonly string[];
  /**
   * When given, every request needs an access token this resolver knows
   * (401 otherwise): for a service bound beyond loopback. Default: none.
   */
  identify?: IdentityResolver;
  /**
   * Resolve tokens against the library's users (fieldgap users) first: a
   * user's token names them and their group, and routes show only that
   * group's records. `identify` then serves only while no user is defined.
   * Default false (loopback: the single-user mode).
   */
  identifyUsers?: boolean;
}

/** The app, plus what it needs to stop: the pool it owns and the library. */
export type FieldgapApp = Express & {
  /** Stops what the app owns (its worker pool, the library); the HTTP server is the caller's. */
  close(): Promise<void>;
  readonly pool: ComputePool;
  /** The results library (opened on first use). */
  readonly library: Library;
};

const CSP_DIRECTIVES = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'"],
  styleSrc: ["'self'"],
  fontSrc: ["'self'"],
  imgSrc: ["'self'"],
  connectSrc: ["'self'"],
  objectSrc: ["'none'"],
  baseUri: ["'self'"],
  formAction: ["'self'"],
  frameAncestors: ["'none'"],
};

export function createApp(options: AppOptions = {}): FieldgapApp {
  const {
    pool: poolOption = 'workers',
    requestTimeoutMs = 10_000,
    maxBodyBytes = 10 * MIB,
    maxJsonBytes = MIB,
    logger = createLogger(),
    staticDir = defaultStaticDir(),
    dataDir,
    database,
    allowedHosts = LOOPBACK_HOSTS,
    identify,
    identifyUsers = false,
  } = options;
  const ownsPool = typeof poolOption === 'string';
  const pool = poolOption === 'workers' ? createWorkerPool() : poolOption === 'in-process' ? createInProcessPool() : poolOption;
  const version = packageVersion();
  const openapi = buildOpenApiDocument(version, { maxBodyBytes, maxJsonBytes, requestTimeoutMs });
  const startedAt = Date.now();
  const location: LibraryLocation = resolveLibraryLocation({ dataFlag: dataDir, databaseFlag: database, env: process.env, cwd: process.cwd() });
  // Opened on first use and again after a failure: the service starts and recovers without its database.
  const library = lazyLibrary(location.engine, () => openLibraryAt(location));

  const app = express();
  app.disable('x-powered-by');
  app.use(
    helmet({
      contentSecurityPolicy: { useDefaults: false, directives: CSP_DIRECTIVES },
      // Served over plain HTTP on loopback: HSTS would pin localhost to https for other tools.
      strictTransportSecurity: false,
    }),
  );
  app.use(requestLogger(logger));
  // Who may ask at all, before any route runs: this server's names only, the token off loopback, no foreign site's writes.
  app.use(hostGuard(allowedHosts));
  const resolve = identifyUsers ? usersResolver(library.users, identify) : identify;
  // Health before the token check: a proxy's health check needs no token (it gets the short answer, routes/health.ts).
  app.get('/api/v1/health', healthHandler({ version, startedAt, pool, library, resolve }));
  app.use(authenticate(resolve));
  app.use(originGuard());
  app.use(declaredLengthGuard(Math.max(maxBodyBytes + MULTIPART_OVERHEAD_BYTES, maxJsonBytes)));
  app.use('/api', express.json({ limit: maxJsonBytes }), jsonDepthGuard());

  const api = express.Router();
  api.get('/openapi.json', (_req, res) => {
    res.json(openapi);
  });
  api.use(createComputeRouter({ pool, timeoutMs: requestTimeoutMs }));
  const analyze = analyzeInPool(pool, requestTimeoutMs);
  api.use(createAnalyzeRouter({ analyze, maxBodyBytes }));
  // The results library: /api/v1/analyses (its records) and /api/v1/series, /api/v1/predict.
  api.use('/analyses', createAnalysesRouter({ library, analyze, list: spectraInPool(pool, requestTimeoutMs), maxBodyBytes }));
  api.use(createSeriesRouter({ library }));
  app.use('/api/v1', api);

  if (staticDir !== false && existsSync(staticDir)) {
    app.use(express.static(staticDir, { dotfiles: 'ignore', index: 'index.html', redirect: false }));
  }
  app.use(notFoundHandler);
  app.use(errorHandler(logger));

  let closed = false;
  const close = async () => {
    if (closed) return;
    closed = true;
    try {
      if (ownsPool) await pool.close();
    } finally {
      await library.close();
    }
  };
  return Object.assign(app, { close, pool, library });
}
