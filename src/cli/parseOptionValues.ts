import { InputError } from "../io/InputError.js";
import { parseAmount } from "../io/parseAmount.js";

/** Reads a money option such as --budget 4.5M; bad text is an InputError naming the option. */
export function parseAmountOption(option: string, text: string): number {
  const value = parseAmount(text);
  if (value === undefined) {
    throw new InputError([{ code: "bad-amount", file: option, message: `'${text}' is not an amount`, hint: "write 4500000, 4.5M or 750k" }]);
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

/** Reads a whole number option within bounds. */
export function parseIntegerOption(option: string, text: string, min: number, max: number): number {
  const value = Number(text);
  if (!Number.isInteger(value) || value < min || value > max) {
    throw new InputError([{ code: "bad-option", file: option, message: `'${text}' is not a whole number from ${min} to ${max}`, hint: `give ${option} a whole number` }]);
  }
  return value;
}
