import type { Command } from '../command.js';

/**
 * `fieldgap serve`: the REST service and the web page. The server code lives
 * in server/ and is loaded only when this command runs, so other commands do
 * not pay for Express and the worker pool.
 */
export const serveCommand: Command = {
  name: 'serve',
  summary: 'run the REST service and the web page on this machine (127.0.0.1:5177)',
  usage: `Usage: fieldgap serve [--port 5177] [--host 127.0.0.1] [--data DIR] [--token T] [--allowed-host NAME]

Runs the REST service (and the web page, when built) until SIGTERM or Ctrl-C.

Options:
  --port N      TCP port (default 5177; 0 picks a free one)
  --host H      interface to listen on (default 127.0.0.1: this machine only)
  --data DIR    folder of the results library (default $FIELDGAP_DATA, else ./fieldgap-data)
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
    const { runServe } = await import('../../../server/main.js');
    return runServe(argv, io);
  },
};
