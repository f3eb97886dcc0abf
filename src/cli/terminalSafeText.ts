// C0 and C1 controls (but tab and line feed), a carriage return not ending a CRLF line, and the
// bidirectional controls that can make a terminal show text in another order than it was written.
const UNSAFE = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]|\r(?!\n)/g;

/**
 * Text made safe to print on a terminal: every control character that could move the cursor,
 * recolour, retitle or reorder the screen (ANSI/OSC escapes, BEL, backspace, bidi overrides) is
 * written as \uXXXX. That form is also a valid JSON escape of the same character, so JSON output
 * keeps its meaning. Tab, line feed and CRLF line ends are kept.
 */
export function terminalSafeText(text: string): string {
  return text.replace(UNSAFE, (character) => `\\u${character.charCodeAt(0).toString(16).padStart(4, "0")}`);
}
