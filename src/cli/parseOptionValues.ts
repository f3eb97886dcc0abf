import { InputError } from "../io/InputError.js";
import { amountHint, parseAmount } from "../io/parseAmount.js";

/** Reads a money option such as --budget 4.5M; bad text is an InputError naming the option. */
export function parseAmountOption(option: string, text: string): number {
  const value = parseAmount(text);
  if (value === undefined) {
    throw new InputError([{ code: "bad-amount", file: option, message: `'${text}' is not an amount`, hint: amountHint(text) }]);
  }
  return value;
}

/** Reads one of a fixed set of words for an option. */
export function parseChoiceOption<T extends string>(option: string, text: string, allowed: readonly T[]): T {
  if (!(allowed as readonly string[]).includes(text)) {
    throw new InputError([{ code: "bad-option", file: option, message: `'${text}' is not allowed`, hint: `use one of: ${allowed.join(", ")}` }]);
  }
  return text as T;
}

/** Reads a whole number option within bounds, written in plain digits (not 1e3 or 0x10). */
export function parseIntegerOption(option: string, text: string, min: number, max: number): number {
  const value = /^\s*[0-9]+\s*$/.test(text) ? Number(text) : Number.NaN;
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new InputError([{ code: "bad-option", file: option, message: `'${text}' is not a whole number from ${min} to ${max}`, hint: `give ${option} a whole number in plain digits` }]);
  }
  return value;
}
