/** Where in a user's file something is wrong. Line and column are 1-based. */
export interface InputProblem {
  /** A stable code tests can assert on, e.g. "yaml-syntax", "schema", "unknown-id". */
  readonly code: string;
  readonly file: string;
  readonly line?: number;
  readonly column?: number;
  /** Field path in the document, e.g. "sites[3].candidates[1]". */
  readonly path?: string;
  readonly message: string;
  /** How to fix it. */
  readonly hint?: string;
}

/** Formats one problem as `file:line:col: path: message (hint)`. */
export function formatProblem(problem: InputProblem): string {
  const where = [problem.file, problem.line, problem.column].filter((part) => part !== undefined).join(":");
  const path = problem.path ? ` ${problem.path}:` : "";
  const hint = problem.hint ? ` (${problem.hint})` : "";
  return `${where}:${path} ${problem.message}${hint}`;
}

/**
 * The one error class for bad input. It carries every problem found, so a user can fix a file
 * in one pass. Only the CLI turns it into text and exit code 2.
 */
export class InputError extends Error {
  readonly problems: readonly InputProblem[];

  constructor(problems: readonly InputProblem[]) {
    super(problems.map(formatProblem).join("\n"));
    this.name = "InputError";
    this.problems = problems;
  }

  /** The first problem's code, for tests and callers that branch on it. */
  get code(): string {
    return this.problems[0]?.code ?? "input";
  }
}
