import { Command, CommanderError } from "commander";
import { allowOutsideFiles } from "../io/allowedInputPath.js";
import { InputError, formatProblem } from "../io/InputError.js";
import { forgetRunInputs } from "../io/runInputs.js";
import type { CliIo } from "./CliIo.js";
import { terminalSafeText } from "./terminalSafeText.js";
import type { CommandOutcome } from "./solveExitCode.js";
import { registerCheckCommand } from "./commands/checkCommand.js";
import { registerCompareCommand } from "./commands/compareCommand.js";
import { registerFrontierCommand } from "./commands/frontierCommand.js";
import { registerInitCommand } from "./commands/initCommand.js";
import { registerPlanCommand } from "./commands/planCommand.js";
import { registerUncertaintyCommand } from "./commands/uncertaintyCommand.js";
import { registerReportCommand } from "./commands/reportCommand.js";
import { registerEvaluateCommand } from "./commands/evaluateCommand.js";
import { registerScreenCommand } from "./commands/screenCommand.js";
import { registerTallyCommand } from "./commands/tallyCommand.js";
import { registerWorkbookCommand } from "./commands/workbookCommand.js";

/**
 * Exit codes: 0 success, 1 internal fault, 2 bad input or usage; 3 no feasible list and 4 no list
 * solved (EXIT_INFEASIBLE, EXIT_NOT_SOLVED in solveExitCode.ts), set by the commands that solve.
 */
export const EXIT_OK = 0;
export const EXIT_FAULT = 1;
export const EXIT_BAD_INPUT = 2;

/** Builds the command tree; every command writes through `io`, and solving commands set `outcome`. */
export function createProgram(io: CliIo, outcome: CommandOutcome = { exitCode: EXIT_OK }): Command {
  const program = new Command("averta")
    .description("Choose the road-safety capital list that avoids the most K+A crashes (KSI crashes: a fatality or a serious injury; crashes, not people) within budget.")
    .version("0.1.0")
    .option("--allow-outside-files", "let a scenario's relative paths (catalogues, sites file) reach files outside its folder and the catalogs folders above it")
    .showHelpAfterError("(run with --help for usage)")
    .configureOutput({ writeOut: io.stdout, writeErr: io.stderr })
    .exitOverride();
  registerCheckCommand(program, io);
  registerPlanCommand(program, io, outcome);
  registerUncertaintyCommand(program, io, outcome);
  registerReportCommand(program, io, outcome);
  registerWorkbookCommand(program, io, outcome);
  registerFrontierCommand(program, io, outcome);
  registerCompareCommand(program, io, outcome);
  registerTallyCommand(program, io);
  registerInitCommand(program, io);
  registerScreenCommand(program, io);
  registerEvaluateCommand(program, io);
  for (const command of program.commands) command.exitOverride().configureOutput({ writeOut: io.stdout, writeErr: io.stderr });
  program.hook("preAction", (_program, action) => allowOutsideFiles(action.optsWithGlobals<{ allowOutsideFiles?: boolean }>().allowOutsideFiles === true));
  return program;
}

/**
 * Runs averta with `argv` (without the node and script entries) and returns the exit code.
 * The only place that turns errors into messages: bad input prints located problems, a fault
 * prints one line (the stack only with AVERTA_DEBUG=1).
 */
export async function runCli(argv: readonly string[], rawIo: CliIo): Promise<number> {
  // Everything printed goes through one filter, so no id, name or message can drive the terminal.
  // A progress redraw starts with a carriage return of our own, which is kept.
  const io: CliIo = {
    stdout: (text) => rawIo.stdout(terminalSafeText(text)),
    stderr: (text) => rawIo.stderr(text.startsWith("\r") ? `\r${terminalSafeText(text.slice(1))}` : terminalSafeText(text)),
    stderrIsTty: rawIo.stderrIsTty,
  };
  const outcome: CommandOutcome = { exitCode: EXIT_OK };
  const program = createProgram(io, outcome);
  // Each run starts with no inputs read and the default path policy (tests run many in one process).
  forgetRunInputs();
  allowOutsideFiles(false);
  try {
    await program.parseAsync([...argv], { from: "user" });
    return outcome.exitCode;
  } catch (error) {
    if (error instanceof InputError) {
      io.stderr(error.problems.map((problem) => `error: ${formatProblem(problem)}`).join("\n") + "\n");
      return EXIT_BAD_INPUT;
    }
    if (error instanceof CommanderError) {
      if (error.code === "commander.helpDisplayed" || error.code === "commander.version") return EXIT_OK;
      // Help shown because no command was given is a usage mistake (commander's exit code is then non-zero).
      if (error.code === "commander.help") return error.exitCode === 0 ? EXIT_OK : EXIT_BAD_INPUT;
      return EXIT_BAD_INPUT; // commander has already printed the usage problem
    }
    const message = error instanceof Error ? error.message : String(error);
    io.stderr(`internal error: ${message}\nThis is a fault in averta, not in your files; please report it with the command you ran.\n`);
    if (process.env.AVERTA_DEBUG === "1" && error instanceof Error) io.stderr(`${error.stack}\n`);
    return EXIT_FAULT;
  }
}
