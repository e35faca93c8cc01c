/**
 * Request validation at the edge: text fields coerced where the schema wants
 * numbers or booleans, then parsed with the zod schema; a failure becomes a
 * FieldgapError('invalid-argument') naming the field.
 */
import type { z } from 'zod';
import { coerceFields } from './coerce.js';
import { zodToFieldgapError } from './errors.js';

/** Fields that arrived as text (query string, form): coerced, then validated. */
export function parseTextFields<S extends z.ZodObject>(schema: S, fields: unknown): z.output<S> {
  const raw = fields !== null && typeof fields === 'object' ? (fields as Record<string, unknown>) : {};
  const coerced = coerceFields(schema.shape as Record<string, z.core.$ZodType>, raw);
  const result = schema.safeParse(coerced);
  if (!result.success) throw zodToFieldgapError(result.error, coerced);
  return result.data;
}

/** A JSON body: validated as it is (JSON already has numbers and booleans). */
export function parseJsonBody<S extends z.ZodType>(schema: S, body: unknown): z.output<S> {
  const result = schema.safeParse(body);
  if (!result.success) throw zodToFieldgapError(result.error, body);
  return result.data;
}
