import { InputError, type InputProblem } from "./InputError.js";
import { checkOutputTarget, writeOutputFile } from "./writeOutputFile.js";

/**
 * Writes several files that belong together (e.g. an output and its report). Every target is
 * checked before any is written, and every refusal is listed, so a refusal never leaves half of
 * the set behind.
 */
export function writeOutputFiles(files: readonly { readonly path: string; readonly content: string; readonly option?: string }[], force: boolean): void {
  const problems: InputProblem[] = [];
  for (const file of files) {
    try {
      checkOutputTarget(file.path, force, file.option);
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      problems.push(...error.problems);
    }
  }
  if (problems.length > 0) throw new InputError(problems);
  for (const file of files) writeOutputFile(file.path, file.content, force, file.option);
}
