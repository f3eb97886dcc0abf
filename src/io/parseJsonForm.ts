import { InputError } from "./InputError.js";

/** A path into a document: mapping keys and list indices. */
export type JsonPathSegment = string | number;

/** A document read by the JSON fast path, with positions found only when asked for. */
export interface JsonFormSource {
  readonly data: unknown;
  /** 1-based line and column of the value (or with `key`, of the key) at `path`, or of its nearest ancestor. */
  readonly positionOf: (path: readonly JsonPathSegment[], key: boolean) => { line: number; column: number };
}

/**
 * The fast path for YAML written in its JSON form (`{ … }` after any leading `#` comment lines):
 * such a file is also JSON, which the engine's own parser reads a hundred times faster than a
 * YAML library. One linear scan first enforces what the YAML reader enforces (no repeated key in a
 * mapping, nesting at most `maxDepth`), then JSON.parse reads the data; positions for messages
 * are indexed by a second scan only when a message needs one. Returns undefined when the text is
 * not in this form or is not valid JSON, so the caller reads it as YAML (and reports YAML's
 * messages). `label` names the file in messages.
 */
export function parseJsonForm(text: string, label: string, maxDepth: number): JsonFormSource | undefined {
  const start = bodyStart(text);
  if (text.charCodeAt(start) !== 0x7b /* { */) return undefined;
  const lines = lineStarts(text);
  const at = (offset: number) => {
    let lo = 0;
    let hi = lines.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (lines[mid]! <= offset) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: offset - lines[lo]! + 1 };
  };
  const checked = scan(text, start, maxDepth, undefined);
  if (checked === "invalid") return undefined;
  if (checked !== undefined) {
    const { line, column } = at(checked.offset);
    throw new InputError([
      checked.kind === "duplicate-key"
        ? { code: "duplicate-key", file: label, line, column, message: "Map keys must be unique", hint: "each key may appear once in a mapping; remove or rename the repeated one" }
        : { code: "too-deep", file: label, line, column, message: `lists and mappings are nested more than ${maxDepth} levels deep`, hint: "a scenario needs only a few levels of nesting; check for runaway indentation or brackets" },
    ]);
  }
  let data: unknown;
  try {
    data = JSON.parse(text.slice(start));
  } catch {
    return undefined;
  }
  let index: Map<string, { value: number; key: number }> | undefined;
  return {
    data,
    positionOf: (path, key) => {
      index ??= buildIndex(text, start, maxDepth);
      for (let depth = path.length; depth >= 0; depth--) {
        const found = index.get(pathKey(path.slice(0, depth)));
        if (found !== undefined) return at(key && depth === path.length && found.key >= 0 ? found.key : found.value);
      }
      return { line: 1, column: 1 };
    },
  };
}

// Skips blank lines and full-line comments before the body.
function bodyStart(text: string): number {
  let position = 0;
  for (;;) {
    while (position < text.length && (text[position] === " " || text[position] === "\t" || text[position] === "\n" || text[position] === "\r")) position++;
    if (text[position] !== "#") return position;
    while (position < text.length && text[position] !== "\n") position++;
  }
}

function lineStarts(text: string): number[] {
  const starts = [0];
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c === 0x0a) starts.push(i + 1);
    else if (c === 0x0d && text.charCodeAt(i + 1) !== 0x0a) starts.push(i + 1);
  }
  return starts;
}

const pathKey = (path: readonly JsonPathSegment[]) => path.map((segment) => (typeof segment === "number" ? `#${segment}` : `.${segment}`)).join("\u0000");

interface Frame {
  readonly object: boolean;
  readonly keys: Set<string> | undefined;
  readonly path: JsonPathSegment[];
  index: number;
  pendingKey: string | undefined;
  keyOffset: number;
}

type ScanProblem = { kind: "duplicate-key" | "too-deep"; offset: number } | "invalid" | undefined;

/**
 * Walks the structure of a JSON text once, without building values: checks repeated keys and
 * depth, and with `record` reports each value's (and key's) offset by path. Returns "invalid" at
 * the first thing that is not JSON; JSON.parse then decides.
 */
function scan(text: string, start: number, maxDepth: number, record: ((path: readonly JsonPathSegment[], value: number, key: number) => void) | undefined): ScanProblem {
  const stack: Frame[] = [];
  let position = start;
  const skipSpace = () => {
    while (position < text.length) {
      const c = text.charCodeAt(position);
      if (c !== 0x20 && c !== 0x09 && c !== 0x0a && c !== 0x0d) return;
      position++;
    }
  };
  // Reads a string from position (at its opening quote); returns its decoded text.
  const readString = (): string | undefined => {
    const open = position;
    position++;
    let escaped = false;
    while (position < text.length) {
      const c = text.charCodeAt(position);
      if (c === 0x22 /* " */) {
        position++;
        const raw = text.slice(open + 1, position - 1);
        if (!escaped) return raw;
        try {
          return JSON.parse(text.slice(open, position)) as string;
        } catch {
          return undefined;
        }
      }
      if (c === 0x5c /* \ */) {
        escaped = true;
        position += 2;
        continue;
      }
      if (c < 0x20) return undefined;
      position++;
    }
    return undefined;
  };
  const childPath = (frame: Frame | undefined): JsonPathSegment[] => (frame === undefined ? [] : [...frame.path, frame.object ? frame.pendingKey! : frame.index]);

  for (;;) {
    skipSpace();
    const frame = stack.at(-1);
    // Inside an object expecting a key (or its end).
    if (frame?.object && frame.pendingKey === undefined) {
      if (text[position] === "}") {
        position++;
        stack.pop();
        if (!afterValue()) return "invalid";
        if (stack.length === 0) return undefined;
        continue;
      }
      if (text[position] !== '"') return "invalid";
      const keyOffset = position;
      const name = readString();
      if (name === undefined) return "invalid";
      if (frame.keys!.has(name)) return { kind: "duplicate-key", offset: keyOffset };
      frame.keys!.add(name);
      skipSpace();
      if (text[position] !== ":") return "invalid";
      position++;
      frame.pendingKey = name;
      frame.keyOffset = keyOffset;
      continue;
    }
    if (frame !== undefined && !frame.object && text[position] === "]") {
      position++;
      stack.pop();
      if (!afterValue()) return "invalid";
      if (stack.length === 0) return undefined;
      continue;
    }
    // A value.
    const valueOffset = position;
    const path = childPath(frame);
    record?.(path, valueOffset, frame?.object ? frame.keyOffset : -1);
    const c = text[position];
    if (c === "{" || c === "[") {
      if (stack.length >= maxDepth) return { kind: "too-deep", offset: valueOffset };
      position++;
      stack.push({ object: c === "{", keys: c === "{" ? new Set() : undefined, path, index: 0, pendingKey: undefined, keyOffset: -1 });
      continue;
    }
    if (c === '"') {
      if (readString() === undefined) return "invalid";
    } else {
      const begin = position;
      while (position < text.length && /[-+.0-9eEtruefalsn]/.test(text[position]!)) position++;
      if (position === begin) return "invalid";
    }
    if (!afterValue()) return "invalid";
    if (stack.length === 0) return undefined;
  }

  // After a value: a comma moves to the next member, a closing bracket is left for the loop.
  function afterValue(): boolean {
    skipSpace();
    const frame = stack.at(-1);
    if (frame === undefined) {
      return position === text.length || /^\s*$/.test(text.slice(position));
    }
    if (frame.object) frame.pendingKey = undefined;
    else frame.index++;
    if (text[position] === ",") {
      position++;
      return true;
    }
    return text[position] === (frame.object ? "}" : "]");
  }
}

function buildIndex(text: string, start: number, maxDepth: number): Map<string, { value: number; key: number }> {
  const index = new Map<string, { value: number; key: number }>();
  scan(text, start, maxDepth, (path, value, key) => index.set(pathKey(path), { value, key }));
  return index;
}
