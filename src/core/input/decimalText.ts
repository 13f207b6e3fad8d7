/**
 * Exact reading of numbers typed by a person. The text is kept as an exact decimal (its digits and
 * a power of ten), scaled exactly (percent: / 100, basis points: / 10,000) by moving the decimal
 * point, and only then rounded once to the nearest float64, so "3.25%" gives exactly the double
 * nearest 0.0325 and never 3.25 / 100 rounded twice. Digits are never dropped, however many are
 * typed. No arithmetic library: the few operations a typed cell needs are shifts and comparisons.
 */

/** Unicode minus signs and dashes a spreadsheet or a word processor may put in front of a number. */
const MINUS_SIGNS = /[\u2212\u2012\u2013\u2014\uFE63\uFF0D]/g;
const MAX_EXPONENT = 1000;
const NUMBER_RE = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/;

/** Text with Unicode minus signs replaced by "-", non-breaking and thin spaces removed, trimmed. */
export function normaliseNumberText(text: string): string {
  return text.replace(MINUS_SIGNS, '-').replace(/[\s\u00A0\u2009\u202F]+/g, '').trim();
}

/**
 * An exact decimal: (−1)^negative × coefficient × 10^exponent, the coefficient a string of digits
 * with no leading or trailing zeros ("" for zero, whose sign is kept as typed, as in "-0").
 */
export class ExactDecimal {
  private constructor(
    readonly negative: boolean,
    private readonly coefficient: string,
    private readonly exponent: number,
  ) {}

  /** The decimal written in `text` (already normalised: see normaliseNumberText), or null when it is not a plain number. */
  static parse(text: string): ExactDecimal | null {
    const m = NUMBER_RE.exec(text);
    if (!m) return null;
    const whole = m[2]!;
    const fraction = m[3] ?? '';
    if (whole === '' && fraction === '') return null;
    const exponentText = m[4];
    const exponent = exponentText === undefined ? 0 : Number(exponentText);
    // Far past any double (about 1e−324 to 1e308): not a figure anyone types, and its plain text would be huge.
    if (!(Math.abs(exponent) <= MAX_EXPONENT)) return null;
    return ExactDecimal.of(m[1] === '-', whole + fraction, exponent - fraction.length);
  }

  /** The exact decimal of a double's shortest round-trip text (what String(x) prints); null for a non-finite x. */
  static fromNumber(x: number): ExactDecimal | null {
    return Number.isFinite(x) ? ExactDecimal.parse(Object.is(x, -0) ? '-0' : String(x)) : null;
  }

  private static of(negative: boolean, digits: string, exponent: number): ExactDecimal {
    const lead = digits.replace(/^0+/, '');
    const coefficient = lead.replace(/0+$/, '');
    return new ExactDecimal(negative, coefficient, exponent + (lead.length - coefficient.length));
  }

  isZero(): boolean {
    return this.coefficient === '';
  }

  abs(): ExactDecimal {
    return new ExactDecimal(false, this.coefficient, this.exponent);
  }

  /** The value times 10^power, exactly (2: a decimal rate in percent; −2: percent as a decimal). */
  shifted(power: number): ExactDecimal {
    return new ExactDecimal(this.negative, this.coefficient, this.exponent + power);
  }

  /** −1, 0 or 1 as |value| is below, at or above 10^power. */
  compareSizeToPowerOfTen(power: number): -1 | 0 | 1 {
    if (this.isZero()) return -1;
    const leading = this.coefficient.length - 1 + this.exponent; // 10^leading <= |value| < 10^(leading + 1)
    if (leading !== power) return leading < power ? -1 : 1;
    return this.coefficient === '1' ? 0 : 1;
  }

  /** Plain decimal text, no exponent, no trailing zeros: "3.25", "-0.000325", "100000"; zero is "0". */
  toFixed(): string {
    if (this.isZero()) return '0';
    const c = this.coefficient;
    let body: string;
    if (this.exponent >= 0) body = c + '0'.repeat(this.exponent);
    else {
      const point = c.length + this.exponent;
      body = point > 0 ? `${c.slice(0, point)}.${c.slice(point)}` : `0.${'0'.repeat(-point)}${c}`;
    }
    return this.negative ? `-${body}` : body;
  }

  /** The double nearest the exact value (ECMAScript's string-to-number rounding, to nearest, ties to even). */
  toNumber(): number {
    return Number(`${this.negative ? '-' : ''}${this.isZero() ? '0' : this.coefficient}e${this.exponent}`);
  }
}

/** The exact decimal written in `text` (already normalised), or null when it is not a plain number. */
export const exactDecimal = (text: string): ExactDecimal | null => ExactDecimal.parse(text);

/** The double nearest the exact value `d` divided by 10^power (0: as typed, 2: percent, 4: basis points). */
export function nearestDouble(d: ExactDecimal, power: number): number {
  return d.shifted(-power).toNumber();
}
