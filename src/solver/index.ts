export { buildGroupHull } from "./buildGroupHull.js";
export { checkSolution, type SolutionCheck } from "./checkSolution.js";
export { prepareProgramme, type PreparedProgramme, type ProgrammeChange } from "./prepareProgramme.js";
export { solveProgramme } from "./solveProgramme.js";
export * from "./types.js";
