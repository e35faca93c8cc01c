import type { Command } from '../command.js';
import { analyzeCommand } from './analyze.js';
import { levelsCommand } from './levels.js';
import { fitCommand } from './fit.js';
import { diagramCommand } from './diagram.js';
import { libraryCommand } from './library.js';
import { seriesCommand } from './series.js';
import { serveCommand } from './serve.js';
import { predictCommand } from './predict.js';
import { watchCommand } from './watch.js';
import { usersCommand } from './users.js';

/**
 * Every CLI command, in the order `fieldgap --help` lists them. A new command
 * is one file under commands/ and one line here.
 */
export const commands: Command[] = [
  analyzeCommand,
  levelsCommand,
  fitCommand,
  diagramCommand,
  libraryCommand,
  seriesCommand,
  serveCommand,
  predictCommand,
  watchCommand,
  usersCommand,
];
