/**
 * The CLI as bin/fieldgap runs it, from source (for tests that need a child
 * process, e.g. one run as another user):
 *   node --import tsx tests/storage/helpers/cli-entry.ts library list --data DIR
 */
import { main } from '../../../src/cli/main.js';
import { runServe } from '../../../server/main.js';

await main((argv, io) => runServe(argv, io));
