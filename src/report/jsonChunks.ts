/** Arrays and objects with more entries than this are written entry by entry. */
const SMALL = 64;

/**
 * `JSON.stringify(value, null, 2)` in pieces, byte for byte the same when joined: large arrays
 * and objects (plain ones, such as a plan's list of 20,000 projects) are written one entry at a
 * time, each entry by JSON.stringify and indented to its depth (JSON text never holds a raw line
 * break inside a string, so re-indenting its lines is exact). The whole text is never one string,
 * so writing a large result needs memory for one entry, not for the document.
 */
export function* jsonChunks(value: unknown, depth = 0): Generator<string> {
  const pad = "  ".repeat(depth + 1);
  const indent = (text: string): string => text.replace(/\n/g, `\n${pad}`);
  if (Array.isArray(value) && value.length > 0 && isLarge(value)) {
    yield "[\n";
    for (let i = 0; i < value.length; i += 1) {
      yield pad;
      const entry: unknown = value[i];
      // JSON.stringify writes undefined, functions and symbols in arrays as null.
      const shown = entry === undefined || typeof entry === "function" || typeof entry === "symbol" ? null : entry;
      yield* nested(shown, depth + 1, indent);
      yield i < value.length - 1 ? ",\n" : "\n";
    }
    yield `${"  ".repeat(depth)}]`;
    return;
  }
  if (isPlainObject(value)) {
    const entries = Object.entries(value).filter(([, v]) => v !== undefined && typeof v !== "function" && typeof v !== "symbol");
    if (entries.length > 0 && isLarge(value)) {
      yield "{\n";
      for (let i = 0; i < entries.length; i += 1) {
        const [key, entry] = entries[i]!;
        yield `${pad}${JSON.stringify(key)}: `;
        yield* nested(entry, depth + 1, indent);
        yield i < entries.length - 1 ? ",\n" : "\n";
      }
      yield `${"  ".repeat(depth)}}`;
      return;
    }
  }
  yield JSON.stringify(value, null, 2);
}

function* nested(value: unknown, depth: number, indent: (text: string) => string): Generator<string> {
  if (isLarge(value)) yield* jsonChunks(value, depth);
  else yield indent(JSON.stringify(value, null, 2));
}

// Worth writing in pieces: a big array, or a plain object holding one (at any depth).
function isLarge(value: unknown): boolean {
  if (Array.isArray(value)) return value.length > SMALL || value.some(isLarge);
  if (isPlainObject(value)) {
    const values = Object.values(value);
    return values.length > SMALL || values.some(isLarge);
  }
  return false;
}

// Objects JSON.stringify writes key by key (no toJSON, e.g. not a Date).
function isPlainObject(value: unknown): value is Record<string, unknown> {
  if (value === null || typeof value !== "object") return false;
  const prototype = Object.getPrototypeOf(value) as unknown;
  return (prototype === Object.prototype || prototype === null) && typeof (value as { toJSON?: unknown }).toJSON !== "function";
}
