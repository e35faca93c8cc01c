import { FieldgapError } from '../../errors.js';
import type { Command } from '../command.js';

/**
 * `fieldgap serve`: the REST service and the web page. The server code lives
 * in server/, which the CLI does not import (layers point one way: src/cli and
 * server/ both depend on src/ only); the program entry, bin/fieldgap, hands it
 * over as `io.runService` and loads it only when this command runs, so other
 * commands do not pay for Express and the worker pool.
 */
export const serveCommand: Command = {
  name: 'serve',
  summary: 'run the REST service and the web page on this machine (127.0.0.1:5177)',
  usage: `Usage: fieldgap serve [--port 5177] [--host 127.0.0.1] [--data DIR | --database URL] [--token T] [--allowed-host NAME]

Runs the REST service (and the web page, when built) until SIGTERM or Ctrl-C.

Options:
  --port N      TCP port (default 5177; 0 picks a free one)
  --host H      interface to listen on (default 127.0.0.1: this machine only)
  --data DIR    folder of the results library (default $FIELDGAP_DATA, else ./fieldgap-data)
  --database URL
                a PostgreSQL results library, postgres://user@host:5432/db (default
                $FIELDGAP_DATABASE_URL); several instances may share one
  --token T     access token every request must carry (default $FIELDGAP_TOKEN; beyond
                loopback a new one is made and printed): "Authorization: Bearer T" for
                scripts; the page gets it by opening the printed address once
  --allowed-host NAME
                a DNS name of this machine that requests may use (repeatable; also
                $FIELDGAP_ALLOWED_HOSTS, comma-separated); other Host headers get 403

API under /api/v1 (health, levels, diagram, fit, analyze, analyses); its
OpenAPI description at /api/v1/openapi.json. Request logs go to stdout as
JSON lines (FIELDGAP_LOG_LEVEL=warn for fewer).
`,
  async run(argv, io) {
    if (!io.runService) throw new FieldgapError('internal', 'the service is not part of this entry point; run bin/fieldgap serve');
    return io.runService(argv, io);
  },
};
