// Exact decimal parsing for money input. Amounts arrive as text ("12.50") from forms and as numbers from
// code; both are read digit by digit into a BigInt so no binary floating point ever touches a price.
import { MoneyError } from './errors';

/** `coefficient / 10^scale`, with the sign kept apart so "-0.00" stays zero. */
export type ExactDecimal = { negative: boolean; coefficient: bigint; scale: number };

const PLAIN_DECIMAL = /^([+-]?)(\d+)?(?:\.(\d*))?$/;
const SCIENTIFIC = /^([+-]?)(\d+)?(?:\.(\d*))?e([+-]?\d+)$/i;

function fromParts(sign: string, whole: string | undefined, fraction: string | undefined, exponent: number): ExactDecimal {
  const intDigits = whole ?? '';
  const fracDigits = fraction ?? '';
  if (intDigits === '' && fracDigits === '') throw new MoneyError('invalid_amount', 'An amount needs at least one digit');
  const digits = (intDigits + fracDigits).replace(/^0+(?=\d)/, '') || '0';
  let coefficient = BigInt(digits);
  let scale = fracDigits.length - exponent;
  if (scale < 0) {
    coefficient *= 10n ** BigInt(-scale);
    scale = 0;
  }
  return { negative: sign === '-' && coefficient !== 0n, coefficient, scale };
}

/**
 * Reads "12", "12.5", "-3.10", ".5" exactly. Thousands separators and currency symbols are refused:
 * "1,234" means different things in different locales, so the form must send a plain decimal.
 */
export function parseDecimalString(text: string): ExactDecimal {
  const match = PLAIN_DECIMAL.exec(text.trim());
  if (!match) throw new MoneyError('invalid_amount', `"${text}" is not a plain decimal amount (digits and one "." only)`);
  return fromParts(match[1], match[2], match[3], 0);
}

/**
 * A JavaScript number read as the decimal it prints as (0.1 is read as one tenth, which is what the
 * writer meant). Exponent notation such as 1e-7 is accepted here because String() produces it.
 */
export function parseDecimalNumber(value: number): ExactDecimal {
  if (!Number.isFinite(value)) throw new MoneyError('invalid_amount', `${value} is not a finite amount`);
  const text = String(value);
  const scientific = SCIENTIFIC.exec(text);
  if (scientific) return fromParts(scientific[1], scientific[2], scientific[3], Number(scientific[4]));
  return parseDecimalString(text);
}

export function parseDecimal(value: string | number): ExactDecimal {
  return typeof value === 'number' ? parseDecimalNumber(value) : parseDecimalString(value);
}

/** The same value written with `scale` decimals; callers only ever raise the scale. */
export function rescale(value: ExactDecimal, scale: number): bigint {
  if (scale < value.scale) throw new RangeError('rescale would drop digits');
  return value.coefficient * 10n ** BigInt(scale - value.scale);
}
