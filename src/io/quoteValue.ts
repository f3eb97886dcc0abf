/** Longest stretch of a user's value repeated in a message. */
const SHOWN_CHARACTERS = 60;

/**
 * A value from a user's file, quoted for a message on one line: control characters and line
 * separators are written as \uXXXX (so a value cannot break the line or drive the terminal) and
 * a long value is cut to 60 characters with an ellipsis.
 * @example quoteValue("an\rgle") → "'an\\u000dgle'"
 */
export function quoteValue(text: string): string {
  const cut = text.length > SHOWN_CHARACTERS ? `${text.slice(0, SHOWN_CHARACTERS)}…` : text;
  return `'${cut.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, "0")}`)}'`;
}
