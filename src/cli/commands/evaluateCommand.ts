import type { Command } from "commander";
import { evaluateBuiltProjects, type Evaluation } from "../../analysis/evaluateBuiltProjects.js";
import { localEvidenceEntries } from "../../analysis/localEvidenceEntries.js";
import { formatProblem, InputError } from "../../io/InputError.js";
import { loadBuiltProjects } from "../../io/loadBuiltProjects.js";
import { checkDistinctOutputs, checkOutputTarget, writeOutputFile } from "../../io/writeOutputFile.js";
import { evaluationCsv } from "../../report/evaluation/evaluationCsv.js";
import { evaluationJson } from "../../report/evaluation/evaluationJson.js";
import { evaluationSvg } from "../../report/evaluation/evaluationSvg.js";
import { evaluationTable } from "../../report/evaluation/evaluationTable.js";
import { localEvidenceYaml } from "../../report/evaluation/localEvidenceYaml.js";
import type { Catalogue } from "../../model/types.js";
import type { CliIo } from "../CliIo.js";
import { emitOutput } from "../emitOutput.js";
import { parseChoiceOption } from "../parseOptionValues.js";
import { withRecordCounts } from "./withRecordCounts.js";

const EVALUATE_FORMATS = ["table", "csv", "json"] as const;

interface EvaluateOptions {
  format: string;
  out?: string;
  force?: boolean;
  emitEffects?: string;
  chart?: string;
}

function requireExtension(option: string, file: string | undefined, extensions: readonly string[], what: string): void {
  if (file === undefined || extensions.some((extension) => file.toLowerCase().endsWith(extension))) return;
  throw new InputError([{ code: "bad-option", file: option, message: `'${file}' is not a ${extensions.join(" or ")} file name`, hint: `${what}; give a file name ending in ${extensions[0]}` }]);
}

/** Loads a built-projects file, counts its crashes from records if it names them, prints its warnings and evaluates it. */
export function loadEvaluation(file: string, io: CliIo): { evaluation: Evaluation; catalogue: Catalogue } {
  const loaded = loadBuiltProjects(file);
  const study = withRecordCounts(loaded.projects, file);
  for (const warning of loaded.warnings) io.stderr(`warning: ${formatProblem(warning)}\n`);
  return { evaluation: evaluateBuiltProjects(study, loaded.catalogue), catalogue: loaded.catalogue };
}

/** `averta evaluate <projects.yaml>`: did the built projects work? Empirical Bayes, comparison-group and naive before-after estimates. */
export function registerEvaluateCommand(program: Command, io: CliIo): void {
  program
    .command("evaluate")
    .description("before-after evaluation of built projects: the local CMF of each treatment by Empirical Bayes, comparison group and (biased) naive estimates")
    .argument("<projects>", "built-projects YAML file")
    .option("-f, --format <format>", "table, csv or json", "table")
    .option("-o, --out <file>", "write to this file instead of standard output")
    .option("--emit-effects <file>", "also write the local CMFs as a catalogue file of localEvidence entries (.yaml)")
    .option("--chart <file>", "also write an SVG chart of each local CMF with its 95% interval")
    .option("--force", "replace output files that already exist")
    .action((file: string, options: EvaluateOptions) => {
      const format = parseChoiceOption("--format", options.format, EVALUATE_FORMATS);
      const force = options.force === true;
      requireExtension("--emit-effects", options.emitEffects, [".yaml", ".yml"], "the local evidence is a YAML catalogue file");
      requireExtension("--chart", options.chart, [".svg"], "the chart is SVG");
      const targets = [{ option: "--out", file: options.out }, { option: "--emit-effects", file: options.emitEffects }, { option: "--chart", file: options.chart }];
      checkDistinctOutputs(targets);
      for (const target of targets) if (target.file !== undefined) checkOutputTarget(target.file, force, target.option);
      const { evaluation, catalogue } = loadEvaluation(file, io);
      const content = format === "json" ? JSON.stringify(evaluationJson(evaluation), null, 2) + "\n" : format === "csv" ? evaluationCsv(evaluation) : evaluationTable(evaluation);
      if (options.emitEffects !== undefined) {
        writeOutputFile(options.emitEffects, localEvidenceYaml(localEvidenceEntries(evaluation, catalogue), evaluation.title), force, "--emit-effects");
        io.stderr(`wrote ${options.emitEffects}\n`);
      }
      if (options.chart !== undefined) {
        writeOutputFile(options.chart, evaluationSvg(evaluation), force, "--chart");
        io.stderr(`wrote ${options.chart}\n`);
      }
      emitOutput(io, content, options.out, force);
    });
}
