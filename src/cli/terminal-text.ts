/**
 * Stored text shown on a terminal. A sample name or note may hold escape
 * sequences (ESC[2J clears the screen, OSC 8 forges links, OSC 52 writes the
 * clipboard), CR to overwrite a line, LF to forge one, or bidirectional
 * overrides that reorder what is read. Before such text is printed, every
 * control character (C0, DEL, C1) and bidi control is replaced by a visible
 * escape: "\n", "\r", "\t", "\x1B", "\u202E". Printable text, accents and
 * Greek letters included, is left as it is.
 */

// C0 controls, DEL, C1 controls; bidi embeddings/overrides/isolates; line and paragraph separators.
const UNSAFE = /[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069\u2028\u2029]/g;

const NAMED: Readonly<Record<string, string>> = { '\n': '\\n', '\r': '\\r', '\t': '\\t' };

function escapeOne(char: string): string {
  const named = NAMED[char];
  if (named !== undefined) return named;
  const code = char.charCodeAt(0);
  return code <= 0xff ? `\\x${code.toString(16).toUpperCase().padStart(2, '0')}` : `\\u${code.toString(16).toUpperCase().padStart(4, '0')}`;
}

/** text with its control characters shown as escapes, safe to print on a terminal as one line. */
export function terminalSafe(text: string): string {
  return text.replace(UNSAFE, escapeOne);
}
