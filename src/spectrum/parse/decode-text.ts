import { FieldgapError } from '../../errors.js';

/**
 * Turns file content into text. Bytes are read as UTF-8, or UTF-16 when
 * they start with a UTF-16 byte-order mark, or Windows-1252 when they are
 * not valid UTF-8 (older instrument exports write "µm" or "°C" that way).
 * A leading BOM is dropped.
 *
 * Content that looks binary (a NUL character, or more than 5 % control
 * characters in the first 4 KiB) is refused with 'unsupported-format': an
 * instrument's native binary file has to be exported as text or JCAMP-DX.
 */
export function decodeText(content: string | Uint8Array, path: string): string {
  let text: string;
  if (typeof content === 'string') {
    text = content;
  } else if (content[0] === 0xff && content[1] === 0xfe) {
    text = new TextDecoder('utf-16le').decode(content);
  } else if (content[0] === 0xfe && content[1] === 0xff) {
    text = new TextDecoder('utf-16be').decode(content);
  } else {
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(content);
    } catch {
      text = new TextDecoder('windows-1252').decode(content);
    }
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (looksBinary(text)) {
    throw new FieldgapError(
      'unsupported-format',
      'this is a binary file, not text: export the spectrum as CSV/text or JCAMP-DX',
      path,
    );
  }
  return text;
}

function looksBinary(text: string): boolean {
  const n = Math.min(text.length, 4096);
  let control = 0;
  for (let i = 0; i < n; i++) {
    const c = text.charCodeAt(i);
    if (c === 0) return true;
    if (c < 32 && c !== 9 && c !== 10 && c !== 13 && c !== 12) control++;
  }
  return n > 0 && control / n > 0.05;
}
