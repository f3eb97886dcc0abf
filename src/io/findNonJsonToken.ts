/** A word or number outside quotes that JSON does not allow, and where it starts. */
export interface NonJsonToken {
  readonly token: string;
  readonly line: number;
  readonly column: number;
}

// JSON's numbers (RFC 8259, section 6) and its three literal names; nothing else stands unquoted.
const JSON_NUMBER = /^-?(?:0|[1-9][0-9]*)(?:\.[0-9]+)?(?:[eE][+-]?[0-9]+)?$/;
const JSON_LITERALS = new Set(["true", "false", "null"]);

/**
 * The first unquoted token of `text` that is not a JSON number or literal (RFC 8259): such as
 * 0x1F, 0o17, 012, +5, .5, 1., Infinity, NaN, .inf or a bare word, which a YAML reader would
 * quietly turn into numbers or text. Line and column are 1-based; each LF, CRLF or lone CR ends a line. Undefined
 * when every token is JSON. Cost O(n).
 */
export function findNonJsonToken(text: string): NonJsonToken | undefined {
  let line = 1;
  let lineStart = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (c === "\n" || (c === "\r" && text[i + 1] !== "\n")) {
      line++;
      lineStart = i + 1;
    } else if (c === '"') {
      // Skip the string, honouring backslash escapes.
      for (i++; i < text.length && text[i] !== '"'; i++) if (text[i] === "\\") i++;
    } else if (/[A-Za-z0-9+\-._]/.test(c)) {
      let end = i;
      while (end < text.length && /[A-Za-z0-9+\-._]/.test(text[end]!)) end++;
      const token = text.slice(i, end);
      if (!JSON_NUMBER.test(token) && !JSON_LITERALS.has(token)) return { token, line, column: i - lineStart + 1 };
      i = end - 1;
    }
  }
  return undefined;
}
