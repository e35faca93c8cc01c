/**
 * How many ordinates an (X++(Y..Y)) XYDATA block can decode to, counted from
 * its text without decoding it. A DUP token ("s99999999": repeat the last
 * value 999 999 999 times) lets a few bytes stand for gigabytes of numbers;
 * the reader refuses such a block by this count before any array is made.
 *
 * The count is an upper bound of the ordinates: every character that can
 * start a value counts one (an AFFN number, a sign, a SQZ or DIF letter,
 * '?') except the first value of each line (its X), and a DUP token adds its
 * count less one. With DIF compression each line also repeats the last
 * ordinate of the line before (the Y check), so a block may count up to
 * twice its points: callers compare with twice ##NPOINTS (the exact check
 * runs after decoding).
 */

/** DUP digits: S…Z = 1…8, s = 9 (JCAMP-DX 4.24, ASDF compression). */
function dupDigit(code: number): number {
  if (code >= 83 && code <= 90) return code - 82; // 'S'..'Z'
  if (code === 115) return 9; // 's'
  return -1;
}

function isDigitOrPoint(code: number): boolean {
  return (code >= 48 && code <= 57) || code === 46;
}

function startsValue(code: number, previous: number, following: number): boolean {
  // An AFFN exponent ("1.5E+03"): the E and its sign continue the number.
  if ((code === 69 || code === 101) && isDigitOrPoint(previous) && (following === 43 || following === 45)) return false;
  if ((code === 43 || code === 45) && (previous === 69 || previous === 101)) return false;
  // SQZ '@', 'A'-'I', 'a'-'i'; DIF '%', 'J'-'R', 'j'-'r'; '?' a missing value
  if (code === 64 || code === 37 || code === 63) return true;
  if ((code >= 65 && code <= 82) || (code >= 97 && code <= 114)) return true;
  if (code === 43 || code === 45) return true; // AFFN sign
  if (!isDigitOrPoint(code)) return false;
  // A digit continues the value before it unless a separator came between.
  return previous === -1 || previous === 32 || previous === 9 || previous === 44 || previous === 59;
}

/**
 * Upper bound of the ordinates on the data lines of `text` from offset
 * `start` up to the next "##" line; stops counting as soon as the bound
 * passes `stopAbove` (so a bomb costs no more than its own bytes). Comments
 * after "$$" are skipped.
 */
export function jcampOrdinateBound(text: string, start: number, stopAbove: number): number {
  let count = 0;
  let previous = -1;
  let lineHasX = false;
  let i = start;
  const n = text.length;
  while (i < n) {
    const code = text.charCodeAt(i);
    if (code === 10 || code === 13) {
      previous = -1;
      lineHasX = false;
      i++;
      // A new labelled record ends the block.
      let j = i;
      while (j < n && (text.charCodeAt(j) === 32 || text.charCodeAt(j) === 9)) j++;
      if (text.startsWith('##', j)) return count;
      continue;
    }
    if (code === 36 && text.charCodeAt(i + 1) === 36) {
      // "$$" comment: skip to the end of the line.
      while (i < n && text.charCodeAt(i) !== 10 && text.charCodeAt(i) !== 13) i++;
      continue;
    }
    const dup = dupDigit(code);
    if (dup > 0) {
      let repeat = dup;
      i++;
      while (i < n) {
        const c = text.charCodeAt(i);
        if (c < 48 || c > 57) break;
        // Saturate: only "more than stopAbove" matters, and huge counts must not lose precision into a small number.
        repeat = Math.min(repeat * 10 + (c - 48), Number.MAX_SAFE_INTEGER / 16);
        i++;
      }
      count += repeat - 1;
      previous = 48;
      if (count > stopAbove) return count;
      continue;
    }
    if (startsValue(code, previous, text.charCodeAt(i + 1))) {
      if (lineHasX) count++;
      else lineHasX = true;
    }
    if (count > stopAbove) return count;
    previous = code;
    i++;
  }
  return count;
}
