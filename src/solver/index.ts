/** The solver's public face: what the rest of averta may use. Everything else in src/solver is internal. */
export { checkSolution, type SolutionCheck } from "./checkSolution.js";
export { lpBudgetMarginalValue } from "./lpBudgetMarginalValue.js";
export { prepareProgramme, type PreparedProgramme, type ProgrammeChange } from "./prepareProgramme.js";
export { solveProgramme } from "./solveProgramme.js";
export * from "./types.js";
