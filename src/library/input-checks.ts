/**
 * Checks of what callers hand the library (ids, page numbers, original
 * bytes, JSON objects, search words), each failing with a FieldgapError
 * that names the field.
 */
import { createHash } from 'node:crypto';
import { FieldgapError, invalidArgument } from '../errors.js';

export function checkId(id: unknown): number {
  if (typeof id !== 'number' || !Number.isSafeInteger(id) || id < 1) {
    throw invalidArgument('id', `id: expected a whole number from 1, got ${JSON.stringify(id)}`);
  }
  return id;
}

export function notFound(id: number): FieldgapError {
  return new FieldgapError('not-found', `no analysis with id ${id} in the library`, 'id');
}

export function pageNumber(name: string, value: unknown, fallback: number, min: number, max: number): number {
  if (value === undefined) return fallback;
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    throw invalidArgument(name, `${name}: expected a whole number from ${min} to ${max}, got ${JSON.stringify(value)}`);
  }
  return value;
}

export function originalBytes(content: unknown, max: number): Buffer {
  if (!(content instanceof Uint8Array)) throw invalidArgument('content', 'content: the original file must be given as bytes');
  if (content.length > max) {
    throw new FieldgapError('too-large', `the original file is ${content.length} bytes, over the library's limit of ${max}`, 'content');
  }
  return Buffer.from(content.buffer, content.byteOffset, content.byteLength);
}

export function sha256Hex(bytes: Uint8Array): string {
  return createHash('sha256').update(bytes).digest('hex');
}

export function jsonText(field: string, value: unknown): string {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw invalidArgument(field, `${field}: expected a JSON object`);
  }
  return JSON.stringify(value);
}

export function words(query: string | undefined): string[] {
  return (query ?? '').trim().split(/\s+/).filter((w) => w !== '');
}
