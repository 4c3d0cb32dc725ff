/**
 * Number formatting for the plain-English messages of the profile checks.
 */

/**
 * Formats a number for a message: at most `significantDigits` significant digits, without
 * trailing zeros (850 → '850', 101325.04 → '101325', 0.000123456 → '0.000123456').
 *
 * Method: Number.prototype.toPrecision, then shortest round-trip printing of the rounded value.
 * Notes: non-finite values print as 'NaN', 'Infinity' or '-Infinity'.
 * Source: common practice.
 *
 * @param value number to show
 * @param significantDigits 1–21, default 6
 * @returns text
 */
export function formatNumber(value: number, significantDigits = 6): string {
  if (!Number.isFinite(value)) return String(value)
  return String(Number(value.toPrecision(significantDigits)))
}

/** Quotes a cell or header text for a message, shortening long text: 'abc' → “'abc'”. */
export function quoteText(text: string, maxLength = 40): string {
  const shown = text.length > maxLength ? `${text.slice(0, maxLength - 1)}…` : text
  return `'${shown}'`
}
