import { invalidArgument } from '../errors.js';
import { GEOMETRIES, type FieldParameters, type Geometry } from './types.js';

/**
 * Input checks of the engine's public functions. Each failure is a
 * FieldgapError('invalid-argument') whose path names the parameter.
 */

export function validateD(d: unknown, path = 'd'): asserts d is number {
  if (typeof d !== 'number' || !Number.isInteger(d) || d < 0 || d > 10) {
    throw invalidArgument(path, `${path} must be a whole number of d electrons from 0 to 10, got ${String(d)}`);
  }
}

export function validateGeometry(geometry: unknown, path = 'geometry'): asserts geometry is Geometry {
  if (!GEOMETRIES.includes(geometry as Geometry)) {
    throw invalidArgument(path, `${path} must be one of ${GEOMETRIES.join(', ')}, got ${String(geometry)}`);
  }
}

export function validateFinite(
  value: unknown,
  path: string,
  { min = -Infinity, exclusiveMin = false, unit = ' cm-1' } = {},
): asserts value is number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw invalidArgument(path, `${path} must be a finite number, got ${String(value)}`);
  }
  if (exclusiveMin ? value <= min : value < min) {
    throw invalidArgument(path, `${path} must be ${exclusiveMin ? 'greater than' : 'at least'} ${min}${unit}, got ${value}`);
  }
}

/** Dq ≥ 0, B > 0, C ≥ 0, all finite (cm-1). */
export function validateFieldParameters(params: FieldParameters | undefined): void {
  if (typeof params !== 'object' || params === null) throw invalidArgument('params', 'params must be an object { dq, b, c }');
  validateFinite(params.dq, 'dq', { min: 0 });
  validateFinite(params.b, 'b', { min: 0, exclusiveMin: true });
  validateFinite(params.c, 'c', { min: 0 });
}
