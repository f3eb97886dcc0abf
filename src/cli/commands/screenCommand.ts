import type { Command } from "commander";
import { loadScenario } from "../../io/loadScenario.js";
import { checkOutputTarget } from "../../io/writeOutputFile.js";
import { screenSites } from "../../model/screenSites.js";
import { screenCsv } from "../../report/screenCsv.js";
import { screenJson } from "../../report/screenJson.js";
import { screenTable } from "../../report/screenTable.js";
import type { CliIo } from "../CliIo.js";
import { emitOutput } from "../emitOutput.js";
import { parseChoiceOption, parseIntegerOption } from "../parseOptionValues.js";

const SCREEN_FORMATS = ["table", "csv", "json"] as const;

interface ScreenOptions {
  top: string;
  format: string;
  out?: string;
  force?: boolean;
}

/** `averta screen <scenario>`: rank sites by excess expected K+A crashes and propose the top ones. */
export function registerScreenCommand(program: Command, io: CliIo): void {
  program
    .command("screen")
    .description("rank every site by excess expected K+A crashes (Empirical Bayes) and by observed K+A crashes, and propose the top sites")
    .argument("<scenario>", "scenario YAML file (sites need aadt and a performanceFunction for EB)")
    .option("-n, --top <count>", "how many sites to propose (and show in the table)", "10")
    .option("-f, --format <format>", "table, csv or json", "table")
    .option("-o, --out <file>", "write to this file instead of standard output")
    .option("--force", "replace --out if it already exists")
    .action((file: string, options: ScreenOptions) => {
      const format = parseChoiceOption("--format", options.format, SCREEN_FORMATS);
      const top = parseIntegerOption("--top", options.top, 1, 100000);
      if (options.out !== undefined) checkOutputTarget(options.out, options.force === true);
      const { scenario } = loadScenario(file);
      const screening = screenSites(scenario, top);
      const content = format === "json" ? JSON.stringify(screenJson(screening, scenario.name), null, 2) + "\n" : format === "csv" ? screenCsv(screening, scenario.name) : screenTable(screening, scenario.name, top);
      emitOutput(io, content, options.out, options.force === true);
    });
}
