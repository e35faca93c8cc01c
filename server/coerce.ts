/**
 * Query strings and multipart form fields arrive as text. Rather than write
 * every request schema twice (once over strings, once over numbers), the
 * schemas state the real types and this converts a text value to a number or
 * boolean where the field's schema accepts one. Text that does not look like
 * a number is left alone, so the schema rejects it with a message naming the
 * field and the value ("dq: expected number, got \"abc\"").
 */
import type { z } from 'zod';

type Want = { number: boolean; boolean: boolean };

const NUMBER_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const TRUE_TEXT = new Set(['true', '1', 'yes', 'on']);
const FALSE_TEXT = new Set(['false', '0', 'no', 'off']);

/** What kinds of scalar a schema accepts, looking through optional/default/union wrappers. */
function wants(schema: z.core.$ZodType): Want {
  const def = schema._zod.def as { type: string; innerType?: z.core.$ZodType; options?: z.core.$ZodType[] };
  switch (def.type) {
    case 'number':
      return { number: true, boolean: false };
    case 'boolean':
      return { number: false, boolean: true };
    case 'optional':
    case 'nullable':
    case 'default':
    case 'prefault':
    case 'readonly':
      return def.innerType ? wants(def.innerType) : { number: false, boolean: false };
    case 'union': {
      const all = (def.options ?? []).map(wants);
      return { number: all.some((w) => w.number), boolean: all.some((w) => w.boolean) };
    }
    default:
      return { number: false, boolean: false };
  }
}

/** One text value converted to what the field wants, when it clearly is one. */
export function coerceText(text: string, want: Want): unknown {
  const trimmed = text.trim();
  if (want.number && NUMBER_TEXT.test(trimmed)) return Number(trimmed);
  if (want.boolean) {
    const lower = trimmed.toLowerCase();
    if (TRUE_TEXT.has(lower)) return true;
    if (FALSE_TEXT.has(lower)) return false;
  }
  return text;
}

/**
 * A copy of `fields` (a parsed query string or form) where every text value
 * whose field takes a number or boolean is converted. Unknown fields and
 * repeated fields (arrays) are kept as they are, for the schema to reject.
 */
export function coerceFields(
  shape: Record<string, z.core.$ZodType>,
  fields: Record<string, unknown>,
): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(fields)) {
    const schema = Object.hasOwn(shape, key) ? shape[key] : undefined;
    out[key] = schema !== undefined && typeof value === 'string' ? coerceText(value, wants(schema)) : value;
  }
  return out;
}
