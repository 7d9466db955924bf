/** A whole number with "," between thousands (1,234,567), without loading locale data. */
export function thousands(x: number): string {
  const digits = String(Math.round(Math.abs(x)));
  let out = "";
  for (let i = 0; i < digits.length; i++) {
    if (i > 0 && (digits.length - i) % 3 === 0) out += ",";
    out += digits[i];
  }
  return x < 0 ? `-${out}` : out;
}
