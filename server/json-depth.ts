/**
 * A JSON body nested thousands of levels deep parses (JSON.parse does not
 * recurse) but breaks everything that walks it recursively afterwards:
 * validation, error messages, logging. No request of this API nests more
 * than a few levels, so bodies deeper than MAX_JSON_DEPTH are refused (400)
 * right after parsing, by a walk with an explicit stack.
 */
import type { NextFunction, Request, Response } from 'express';
import { FieldgapError } from '../src/errors.js';

/** Deepest nesting a JSON body may have: an array or object inside another counts one level. */
export const MAX_JSON_DEPTH = 32;

/** True when value nests arrays/objects more than maxDepth levels (the top level is 1). Iterative. */
export function jsonDeeperThan(value: unknown, maxDepth: number): boolean {
  const stack: Array<[unknown, number]> = [[value, 1]];
  while (stack.length > 0) {
    const [item, depth] = stack.pop()!;
    if (item === null || typeof item !== 'object') continue;
    if (depth > maxDepth) return true;
    const children = Array.isArray(item) ? item : Object.values(item as Record<string, unknown>);
    for (const child of children) if (child !== null && typeof child === 'object') stack.push([child, depth + 1]);
  }
  return false;
}

/** The middleware, after express.json: 400 for a body nested deeper than maxDepth. */
export function jsonDepthGuard(maxDepth = MAX_JSON_DEPTH) {
  return (req: Request, _res: Response, next: NextFunction): void => {
    if (req.body !== null && typeof req.body === 'object' && jsonDeeperThan(req.body, maxDepth)) {
      next(new FieldgapError('invalid-argument', `body: the JSON is nested more than ${maxDepth} levels deep; no request of this API needs that`, 'body'));
      return;
    }
    next();
  };
}
