import { InputError, type InputProblem } from "./InputError.js";

/** How a referenced file is named in messages, and what to say when it is missing or not a file. */
export interface ReferencedFile {
  /** e.g. "catalogue 'x.yaml'" */
  readonly label: string;
  readonly resolved: string;
  readonly missingHint: string;
  readonly notAFileHint: string;
}

/**
 * Reads a file a scenario refers to; a file that cannot be opened (missing, or not a file) is a
 * mistake in the scenario, so the error points at the reference `at`, not at the file itself.
 */
export function atReference<T>(read: () => T, at: Omit<InputProblem, "code" | "message">, file: ReferencedFile): T {
  try {
    return read();
  } catch (error) {
    if (error instanceof InputError && (error.code === "missing-file" || error.code === "not-a-file")) {
      const missing = error.code === "missing-file";
      throw new InputError([
        {
          ...error.problems[0]!,
          ...at,
          message: missing ? `${file.label} was not found (looked in ${file.resolved})` : `${file.label} ${error.problems[0]!.message}`,
          hint: missing ? file.missingHint : file.notAFileHint,
        },
      ]);
    }
    throw error;
  }
}
