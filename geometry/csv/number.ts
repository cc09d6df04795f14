/**
 * Strict decimal number parsing for CSV fields, straight from the character codes of the file's
 * text (no substring per field on the common path).
 *
 * Grammar (after trimming spaces and tabs): [+|-] digits [sep digits] [(e|E) [+|-] digits], with at
 * least one digit in the mantissa; `sep` is "." (or "," when the caller chose a decimal comma).
 * Anything else — empty, text, hexadecimal, NaN, Infinity, thousands separators — is rejected, and
 * so is a value that overflows to ±Infinity. The caller gets NaN for "not a number" and asks
 * `describeBadNumber` for the message.
 *
 * Correct rounding: when the mantissa has ≤ 15 digits (< 2^53, exact) and the decimal exponent is
 * within ±22 (10^k exact in binary64), one IEEE multiplication or division gives the correctly
 * rounded result (Clinger, "How to read floating point numbers accurately", PLDI 1990, the "fast
 * path"; reference from memory). Every other case falls back to the engine's own `Number()`, which is correctly rounded
 * per ECMA-262 §7.1.4.1.1.
 */

const POW10: readonly number[] = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

const C_PLUS = 43;
const C_MINUS = 45;
const C_DOT = 46;
const C_COMMA = 44;
const C_0 = 48;
const C_9 = 57;
const C_E = 69;
const C_e = 101;
const C_SPACE = 32;
const C_TAB = 9;

/**
 * Parse text[start, end) as a finite decimal number; NaN if it does not follow the grammar above
 * or is not finite. `decimalComma` selects "," as the decimal separator instead of ".".
 */
export function parseDecimal(text: string, start: number, end: number, decimalComma: boolean): number {
  let s = start;
  let e = end;
  while (s < e) {
    const c = text.charCodeAt(s);
    if (c !== C_SPACE && c !== C_TAB) break;
    s++;
  }
  while (e > s) {
    const c = text.charCodeAt(e - 1);
    if (c !== C_SPACE && c !== C_TAB) break;
    e--;
  }
  if (s === e) return NaN;
  const sep = decimalComma ? C_COMMA : C_DOT;
  let i = s;
  let c = text.charCodeAt(i);
  let negative = false;
  if (c === C_MINUS) {
    negative = true;
    i++;
  } else if (c === C_PLUS) {
    i++;
  }
  let mantissa = 0;
  let digits = 0;
  let fracDigits = 0;
  while (i < e) {
    c = text.charCodeAt(i);
    if (c < C_0 || c > C_9) break;
    mantissa = mantissa * 10 + (c - C_0);
    digits++;
    i++;
  }
  if (i < e && text.charCodeAt(i) === sep) {
    i++;
    while (i < e) {
      c = text.charCodeAt(i);
      if (c < C_0 || c > C_9) break;
      mantissa = mantissa * 10 + (c - C_0);
      digits++;
      fracDigits++;
      i++;
    }
  }
  if (digits === 0) return NaN;
  let exponent = 0;
  if (i < e) {
    c = text.charCodeAt(i);
    if (c !== C_E && c !== C_e) return NaN;
    i++;
    let expNegative = false;
    if (i < e) {
      c = text.charCodeAt(i);
      if (c === C_MINUS) {
        expNegative = true;
        i++;
      } else if (c === C_PLUS) {
        i++;
      }
    }
    let expDigits = 0;
    while (i < e) {
      c = text.charCodeAt(i);
      if (c < C_0 || c > C_9) break;
      if (exponent < 100000) exponent = exponent * 10 + (c - C_0);
      expDigits++;
      i++;
    }
    if (expDigits === 0 || i !== e) return NaN;
    if (expNegative) exponent = -exponent;
  }
  const k = exponent - fracDigits;
  let value: number;
  if (digits <= 15 && k >= -22 && k <= 22) {
    value = k < 0 ? mantissa / POW10[-k]! : mantissa * POW10[k]!;
    if (negative) value = -value;
  } else {
    let raw = text.slice(s, e);
    if (decimalComma) raw = raw.replace(",", ".");
    value = Number(raw);
  }
  return Number.isFinite(value) ? value : NaN;
}

/** Why `raw` (the field as written) was rejected as a number; used only on the error path. */
export function describeBadNumber(raw: string, decimalComma: boolean, delimiter: string): string {
  const t = raw.trim();
  if (t === "") return "empty; a number is required";
  if (!decimalComma && /^[+-]?\d*,\d+([eE][+-]?\d+)?$/.test(t)) {
    return delimiter === ";"
      ? `'${t}' uses a decimal comma; write a decimal point (${t.replace(",", ".")}) or choose the decimal-comma option for this semicolon-separated file`
      : `'${t}' uses a decimal comma; write a decimal point (${t.replace(",", ".")})`;
  }
  if (decimalComma && /^[+-]?\d*\.\d+([eE][+-]?\d+)?$/.test(t)) {
    return `'${t}' uses a decimal point, but the decimal-comma option was chosen for this file`;
  }
  if (/^[+-]?(nan|inf|infinity)$/i.test(t)) return `'${t}' is not a finite number`;
  if (/^[+-]?(\d+([.,]\d*)?|[.,]\d+)[eE][+-]?\d+$/.test(t))
    return `'${t}' is not a finite number (out of range)`;
  const shown = t.length > 40 ? `${t.slice(0, 40)}…` : t;
  return `'${shown}' is not a number`;
}
