import { isAlias, isCollection, isMap, isPair, isScalar, LineCounter, parseDocument, visit, type Document, type Node } from "yaml";
import { readInputBytes } from "./readInputBytes.js";
import { InputError, type InputProblem } from "./InputError.js";
import { parseJsonForm } from "./parseJsonForm.js";
import { quoteValue } from "./quoteValue.js";

/** Largest input file we read: a programme of 100,000 sites fits well below it. */
export const MAX_INPUT_BYTES = 64 * 1024 * 1024;
/** Alias expansions allowed when converting YAML to data (guards against alias bombs). */
const MAX_ALIAS_COUNT = 1000;
/** Deepest nesting of lists and mappings accepted; a scenario needs about six levels. */
export const MAX_NESTING_DEPTH = 100;

export type PathSegment = string | number;

/** A parsed YAML file that can map a field path back to its line and column. */
export interface YamlSource {
  readonly file: string;
  readonly data: unknown;
  /** 1-based line and column of the node at `path`, or of its nearest existing ancestor. */
  positionOf(path: readonly PathSegment[], key?: boolean): { line: number; column: number };
}

/**
 * Reads and parses one YAML file. Every failure (missing, unreadable, not UTF-8, too large,
 * syntax error, duplicate key, alias bomb, nesting too deep) is an InputError with a position.
 */
export function readYamlFile(file: string, label: string = file): YamlSource {
  return parseYamlText(readUtf8(file, label), label);
}

/**
 * Parses YAML text already in memory (e.g. a scenario a command is about to write) with the same
 * checks and positions as readYamlFile; `label` names it in messages.
 */
export function parseYamlText(source: string, label: string): YamlSource {
  // A lone CR ends a line (YAML 1.2, section 5.4; JSON white space), but the parser would keep it
  // as text: one character for another, so every offset, line and column stays right.
  const text = source.replace(/\r(?!\n)/g, "\n");
  // YAML in its JSON form (what tally writes) takes the fast path, with the same checks.
  const fast = parseJsonForm(text, label, MAX_NESTING_DEPTH);
  if (fast !== undefined) return { file: label, data: fast.data, positionOf: (path, key = false) => fast.positionOf(path, key) };
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, uniqueKeys: true, prettyErrors: false, strict: true });
  const problems: InputProblem[] = doc.errors.map((error) => {
    const { line, col } = lineCounter.linePos(error.pos[0]);
    const at = { file: label, line, column: col };
    // The parser reports its own stack running out as RESOURCE_EXHAUSTION: that is nesting, not syntax.
    if (error.code === "RESOURCE_EXHAUSTION") return { code: "too-deep", ...at, message: "the document is nested too deeply to read", hint: TOO_DEEP_HINT };
    if (error.code === "MULTIPLE_DOCS") {
      return { code: "yaml-syntax", ...at, message: "the file holds more than one YAML document", hint: "keep one scenario or catalogue per file: remove this '---' and what follows it" };
    }
    return {
      code: error.code === "DUPLICATE_KEY" ? "duplicate-key" : "yaml-syntax",
      ...at,
      message: firstLine(error.message),
      hint: yamlHint(error.code, text, error.pos[0]),
    };
  });
  if (problems.length > 0) throw new InputError(problems.slice(0, 1).concat(problems.slice(1).filter((p) => p.code !== "too-deep")));
  const deep = firstTooDeepNode(doc);
  if (deep !== undefined) {
    const { line, col } = lineCounter.linePos(deep);
    throw new InputError([{ code: "too-deep", file: label, line, column: col, message: `lists and mappings are nested more than ${MAX_NESTING_DEPTH} levels deep`, hint: TOO_DEEP_HINT }]);
  }

  const based = firstNonDecimalNumber(doc);
  if (based !== undefined) {
    const { line, col } = lineCounter.linePos(based.offset);
    throw new InputError([
      {
        code: "not-decimal",
        file: label,
        line,
        column: col,
        message: `a number written in base ${based.base} (${quoteValue(text.slice(based.offset, based.end))})`,
        hint: "write numbers in decimal, e.g. 31 rather than 0x1F; quote the value if it is text",
      },
    ]);
  }

  let data: unknown;
  try {
    data = doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
  } catch (error) {
    const tooDeep = error instanceof RangeError && /call stack/i.test(error.message);
    const { line, col } = lineCounter.linePos(tooDeep ? 0 : firstAliasOffset(doc));
    throw new InputError([
      {
        code: tooDeep ? "too-deep" : "yaml-aliases",
        file: label,
        line,
        column: col,
        message: tooDeep ? "the document is nested too deeply to read" : `aliases (*name) expand to more than ${MAX_ALIAS_COUNT} copies of their anchors`,
        hint: tooDeep ? TOO_DEEP_HINT : "anchors and aliases expand to too much data; write the values out instead",
      },
    ]);
  }
  return {
    file: label,
    data,
    positionOf: (path, key = false) => positionOf(doc, lineCounter, path, key),
  };
}

const TOO_DEEP_HINT = "a scenario needs only a few levels of nesting; check for runaway indentation or brackets";

// Walks the tree without recursion, so depth itself cannot exhaust the stack; returns the first
// node's offset deeper than the limit.
function firstTooDeepNode(doc: Document): number | undefined {
  const stack: { node: unknown; depth: number }[] = [{ node: doc.contents, depth: 0 }];
  while (stack.length > 0) {
    const { node, depth } = stack.pop()!;
    if (!isCollection(node)) continue;
    if (depth >= MAX_NESTING_DEPTH) return node.range?.[0] ?? 0;
    for (const item of node.items as unknown[]) {
      if (isPair(item)) stack.push({ node: item.key, depth: depth + 1 }, { node: item.value, depth: depth + 1 });
      else stack.push({ node: item, depth: depth + 1 });
    }
  }
  return undefined;
}

// YAML reads 0x1F, 0o17 and 0b101 as numbers; a scenario's numbers are money, rates and counts,
// where such a form is almost surely a mistake, so the first one is refused at its place.
function firstNonDecimalNumber(doc: Document): { offset: number; end: number; base: number } | undefined {
  const bases: Readonly<Record<string, number>> = { HEX: 16, OCT: 8, BIN: 2 };
  let found: { offset: number; end: number; base: number } | undefined;
  visit(doc, {
    Scalar(_key, node) {
      if (typeof node.value !== "number" || node.format === undefined || !Object.hasOwn(bases, node.format)) return undefined;
      found = { offset: node.range?.[0] ?? 0, end: node.range?.[1] ?? 0, base: bases[node.format]! };
      return visit.BREAK;
    },
  });
  return found;
}

function firstAliasOffset(doc: Document): number {
  let offset = 0;
  visit(doc, {
    Alias(_key, node) {
      if (isAlias(node)) offset = node.range?.[0] ?? 0;
      return visit.BREAK;
    },
  });
  return offset;
}

function readUtf8(file: string, label: string): string {
  const bytes = readInputBytes(file, label, MAX_INPUT_BYTES, "split the sites across scenarios or check that this is the right file");
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes).replace(/^\uFEFF/, "");
  } catch {
    const offset = firstInvalidUtf8Offset(bytes);
    const before = bytes.subarray(0, offset).toString("latin1");
    const line = before.split("\n").length;
    const column = offset - before.lastIndexOf("\n");
    throw new InputError([
      {
        code: "not-utf8",
        file: label,
        line,
        column,
        message: "is not valid UTF-8 text",
        hint: "save the file as UTF-8 (most editors offer this under 'Save with encoding')",
      },
    ]);
  }
}

function firstInvalidUtf8Offset(bytes: Buffer): number {
  const decoder = new TextDecoder("utf-8", { fatal: true });
  let low = 0;
  let high = bytes.length;
  // Binary search for the shortest invalid prefix; a cut mid-character is tolerated by trimming 3 bytes.
  while (low < high) {
    const mid = (low + high) >> 1;
    try {
      decoder.decode(bytes.subarray(0, Math.max(0, mid - 3)));
      low = mid + 1;
    } catch {
      high = mid;
    }
  }
  return Math.max(0, low - 4);
}

function firstLine(message: string): string {
  return message.split("\n")[0]!.replace(/ at line \d+, column \d+:?$/, "");
}

function yamlHint(code: string, text: string, offset: number): string | undefined {
  const lineStart = text.lastIndexOf("\n", offset - 1) + 1;
  const lineText = text.slice(lineStart, text.indexOf("\n", offset) === -1 ? undefined : text.indexOf("\n", offset));
  if (/^\s*\t/.test(lineText) || code === "TAB_AS_INDENT") return "YAML indentation must use spaces, not tabs";
  if (code === "DUPLICATE_KEY") return "each key may appear once in a mapping; remove or rename the repeat";
  if (code === "BAD_INDENT" || code === "MISSING_CHAR") return "check the indentation and the ':' after each key";
  return "check the YAML syntax near this position";
}

function positionOf(
  doc: Document,
  lineCounter: LineCounter,
  path: readonly PathSegment[],
  key: boolean,
): { line: number; column: number } {
  for (let depth = path.length; depth >= 0; depth--) {
    const prefix = path.slice(0, depth);
    const node = (prefix.length === 0 ? doc.contents : doc.getIn(prefix, true)) as Node | undefined;
    let offset = node?.range?.[0];
    if (key && depth === path.length && depth > 0) {
      const parent = (depth === 1 ? doc.contents : doc.getIn(path.slice(0, depth - 1), true)) as Node | undefined;
      if (isMap(parent)) {
        const pair = parent.items.find((item) => isScalar(item.key) && item.key.value === path[depth - 1]);
        if (pair && isScalar(pair.key)) offset = pair.key.range?.[0];
      }
    }
    if (offset !== undefined) {
      const { line, col } = lineCounter.linePos(offset);
      return { line, column: col };
    }
  }
  return { line: 1, column: 1 };
}
