/** Spaces a thousands separator may be written with (the number parser accepts the same three). */
const isSpace = (c: number): boolean => c === 0x20 || c === 0xa0 || c === 0x202f;
const isDigit = (c: number): boolean => c >= 48 && c <= 57;

/**
 * Digits of `int` and `frac` with the decimal point moved two places left, as text math on the
 * digits written (no doubles): ("12", "5") is 12.5 -> ("0", "125"), ("150", "") -> ("1", "50").
 */
function shiftPercent(int: string, frac: string): [string, string] {
  const digits = int + frac;
  const point = int.length - 2;
  if (point <= 0) return ["0", "0".repeat(-point) + digits];
  return [digits.slice(0, point), digits.slice(point)];
}

/** True when every character in [start, end) but the one at `mark` is a digit. */
function plainAround(text: string, start: number, end: number, mark: number): boolean {
  for (let i = start; i < end; i++) if (i !== mark && !isDigit(text.charCodeAt(i))) return false;
  return true;
}

/**
 * The plain forms of a number cell the column's parser read as `value`: no thousands separators,
 * no percent sign (the point moved instead), the digits kept exactly as written. Returned with "."
 * as the decimal mark first, then with ",", so a caller can keep the first form its column accepts.
 * Empty when the text cannot be read back to `value` (nothing to rewrite then).
 */
export function plainNumbers(text: string, value: number): string[] {
  let end = text.length;
  let percent = false;
  if (end > 1 && text.charCodeAt(end - 1) === 37) {
    percent = true;
    end = isSpace(text.charCodeAt(end - 2)) ? end - 2 : end - 1;
  }
  const first = text.charCodeAt(0);
  const start = first === 43 || first === 45 ? 1 : 0;
  const sign = text.slice(0, start);
  // The decimal mark, if any, is the last character that is not a digit; every other one groups.
  let last = -1;
  for (let i = start; i < end; i++) if (!isDigit(text.charCodeAt(i))) last = i;
  const readings: number[] = [-1];
  const lastCode = text.charCodeAt(last);
  if (last >= 0 && (lastCode === 46 || lastCode === 44)) readings.unshift(last);
  for (const mark of readings) {
    let int = "";
    let frac = "";
    for (let i = start; i < end; i++) {
      const c = text.charCodeAt(i);
      if (!isDigit(c)) continue;
      if (mark >= 0 && i > mark) frac += text[i];
      else int += text[i];
    }
    if (int === "" && frac === "") continue;
    if (percent) [int, frac] = shiftPercent(int, frac);
    const dot = frac === "" ? `${sign}${int}` : `${sign}${int}.${frac}`;
    // The same exact decimal read by Number and by the column parser is the same double.
    if (Number(dot) !== value) continue;
    // Already plain: only digits around a "." mark. Nothing else (".5" stays ".5").
    if (!percent && (mark < 0 ? last < 0 : lastCode === 46 && plainAround(text, start, end, mark))) return [];
    return frac === "" ? [dot] : [dot, `${sign}${int},${frac}`];
  }
  return [];
}
