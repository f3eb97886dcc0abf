/** Where a command writes: the terminal streams, injectable so commands run in tests in-process. */
export interface CliIo {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
  /** Whether stderr is a terminal (progress bars only then). */
  readonly stderrIsTty: boolean;
}

export const processIo: CliIo = {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  stderrIsTty: Boolean(process.stderr.isTTY),
};
