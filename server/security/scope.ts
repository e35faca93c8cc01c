import type { Response } from 'express';
import type { Library } from '../../src/library/library.js';
import type { Identity } from './auth.js';

/**
 * The library as the request's identity may see it: a user of the users
 * table sees their group's records (an administrator all) and adds in their
 * name; the single-user modes (loopback, one service token) see everything.
 * Every library route takes its library from here, so none can forget the
 * filter.
 */
export function libraryFor(library: Library, res: Response): Library {
  const identity = res.locals['identity'] as Identity | undefined;
  return identity?.scope === undefined ? library : library.scoped(identity.scope);
}
