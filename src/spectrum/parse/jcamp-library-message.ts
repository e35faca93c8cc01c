/**
 * jcampconverter's logger messages about damaged data, in fieldgap's words
 * with the line of the file they are about. The converter counts "Data line
 * d" from 0 at the line after the record's "##XYDATA=" line; its wording
 * ("The difference between the first value -8 and the first x value 400 is
 * too high") is the library's and must not reach a user.
 */

export interface JcampDamage {
  /** 1-based line of the file, when the message names one. */
  line: number | undefined;
  message: string;
}

const DATA_LINE = /^Data line (\d+): /;

/**
 * One logged message as a sentence; `recordLine` is the 0-based line of the
 * record's "##…=" line. A message this function does not know is given as
 * "the data cannot be decoded" with no library text.
 */
export function jcampDamageFromLog(logged: string, recordLine: number): JcampDamage {
  const numbered = DATA_LINE.exec(logged);
  // 0-based data line d is file line recordLine + 1 + d (0-based), so recordLine + 2 + d counted from 1.
  const line = numbered ? recordLine + 2 + Number(numbered[1]) : undefined;
  const body = numbered ? logged.slice(numbered[0].length) : logged;
  return { line, message: sentence(body) };
}

function sentence(body: string): string {
  let m = /^The difference between the first value (\S+) and the first x value (\S+) is too high/.exec(body);
  if (m) return `the line starts at X = ${m[1]}, but ##FIRSTX and ##DELTAX put the next point at X = ${m[2]}: a line is missing, repeated or damaged`;
  m = /^The difference between the first value (\S+) and the expected first x value (\S+) based on increment/.exec(body);
  if (m) return `the line starts at X = ${m[1]}, but the previous line's difference (DIF) form puts it at X = ${m[2]}: a line is missing, repeated or damaged`;
  m = /^After a DIFFERENCE the next line should repeat the last value.*Current value: (\S+) - Expected: (\S+?)\.?$/.exec(body);
  if (m) return `after a line in difference (DIF) form the next line must repeat its last point (X = ${m[2]}); it starts at X = ${m[1]}`;
  if (/^After a duplicate/.test(body)) return 'after a line that ends in a duplicate (DUP) the next line must repeat that value; it does not';
  m = /^Format error: (.*)$/.exec(body);
  if (m) return `a line of the table holds an odd number of values (${shorten(m[1]!)}): every point needs an X and a Y`;
  m = /^Wrong number of columns: (.*)$/.exec(body);
  if (m) return `a line of the table has the wrong number of values (${shorten(m[1]!)}) for the variables the record declares`;
  m = /^Symbol undefined: (.*)$/.exec(body);
  if (m) return `the record uses a variable "${shorten(m[1]!)}" that no ##SYMBOL declares`;
  return 'the data cannot be decoded';
}

function shorten(text: string): string {
  return text.length > 40 ? `${text.slice(0, 37)}...` : text;
}
