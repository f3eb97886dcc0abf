import type { Command } from "commander";
import { realpathSync } from "node:fs";
import { basename, dirname, isAbsolute, join, relative, resolve, sep } from "node:path";
import { allowedInputPath } from "../../io/allowedInputPath.js";
import { InputError } from "../../io/InputError.js";
import { loadCatalogue } from "../../io/loadCatalogue.js";
import { DEFAULT_MAX_TREATMENTS_PER_SITE, loadScenarioSource, type LoadedScenario } from "../../io/loadScenario.js";
import { packageRoot } from "../../io/packageRoot.js";
import { parseYamlText, readYamlFile } from "../../io/readYamlFile.js";
import { validateWithSchema } from "../../io/validateWithSchema.js";
import { checkOutputTarget, writeOutputFile } from "../../io/writeOutputFile.js";
import { DEFAULT_ECONOMICS } from "../../model/defaultEconomics.js";
import { sitesWithoutCandidates } from "../../model/sitesWithoutCandidates.js";
import { DEFAULT_MAX_SUGGESTIONS, suggestCandidates } from "../../model/suggestCandidates.js";
import { formatMoney } from "../../report/formatNumber.js";
import { initScenarioYaml, type ScenarioDraft, type SiteCandidateChoice } from "../../report/initScenarioYaml.js";
import { noCandidatesText } from "../../report/noCandidatesText.js";
import type { CliIo } from "../CliIo.js";
import { parseAmountOption, parseIntegerOption } from "../parseOptionValues.js";

interface InitOptions {
  sites: string;
  catalogue: string[];
  budget: string;
  out: string;
  force?: boolean;
  name: string;
  currency: string;
  maxSuggestions: string;
  suggestAll?: boolean;
}

const DEFAULT_NAME = "Road-safety capital programme";

/** `averta init`: a complete scenario from tally's sites file, a catalogue and a budget, with suggested candidates. */
export function registerInitCommand(program: Command, io: CliIo): void {
  program
    .command("init")
    .description("write a new scenario from a sites file (averta tally's output), a catalogue and a budget, with suggested candidate treatments for an engineer to review")
    .requiredOption("--sites <file>", "sites YAML written by averta tally (crashWindow and sites); the scenario refers to it")
    .requiredOption("--catalogue <file>", "treatment catalogue YAML (repeat for several)", (value: string, previous: string[] | undefined) => [...(previous ?? []), value])
    .requiredOption("-b, --budget <amount>", "capital budget (4500000, 4.5M, 750k)")
    .option("-o, --out <file>", "scenario YAML to write", "scenario.yaml")
    .option("--force", "replace --out if it exists (never one of this run's inputs)")
    .option("--name <text>", "the scenario's name", DEFAULT_NAME)
    .option("--currency <code>", "ISO 4217 code the budget and costs are in", DEFAULT_ECONOMICS.crashCostsCurrency)
    .option("--max-suggestions <count>", "most candidate treatments suggested per site", String(DEFAULT_MAX_SUGGESTIONS))
    .option("--suggest-all", "also suggest for sites whose sites file lists candidates (the suggestions then replace them)")
    .action((options: InitOptions) => {
      const budget = parseAmountOption("--budget", options.budget);
      const maxSuggestions = parseIntegerOption("--max-suggestions", options.maxSuggestions, 1, 50);
      if (!/^[A-Z]{3}$/.test(options.currency)) {
        throw new InputError([{ code: "bad-option", file: "--currency", message: `'${options.currency}' is not an ISO 4217 code`, hint: "give three capital letters, e.g. USD or EUR" }]);
      }
      if (options.name.trim() === "") throw new InputError([{ code: "bad-option", file: "--name", message: "is empty", hint: "give the scenario a name, e.g. --name \"Vellmar 2027 programme\"" }]);
      if (/\.(geo)?json$/i.test(options.sites)) {
        throw new InputError([{ code: "bad-option", file: options.sites, message: "is a GeoJSON or JSON file, not a sites file", hint: "run averta tally --crashes <csv> --sites <geojson> first, and give init the sites YAML it writes" }]);
      }
      checkOutputTarget(options.out, options.force === true);
      refuseInputAsOutput(options.out, [["--sites", options.sites], ...options.catalogue.map((file): [string, string] => ["--catalogue", file])]);
      // Read first on their own, so a missing or malformed input is named by its own path, not
      // through the scenario that would refer to it.
      const sitesProblems = validateWithSchema(readYamlFile(options.sites), "sites");
      if (sitesProblems.length > 0) throw new InputError(sitesProblems);
      for (const file of options.catalogue) loadCatalogue(file);

      const draft: ScenarioDraft = {
        name: options.name.trim(),
        schemaPath: pathFrom(options.out, join(packageRoot(), "schema", "scenario.schema.json")),
        provenance: `Written by averta init from ${basename(options.sites)} and ${options.catalogue.map((file) => basename(file)).join(", ")}.`,
        catalogues: options.catalogue.map((file) => scenarioPath(options.out, file)),
        sitesFile: scenarioPath(options.out, options.sites),
        currency: options.currency,
        budget,
        economics: DEFAULT_ECONOMICS,
        // Empirical Bayes wherever a site allows it; observed counts elsewhere, with a warning.
        baseline: "auto",
        maxTreatmentsPerSite: DEFAULT_MAX_TREATMENTS_PER_SITE,
        maxSuggestions,
        sites: [],
      };
      // Loading the scenario without suggestions checks every input as check would, with the
      // problems located in the user's own files (the sites file and the catalogues).
      const plain = load(initScenarioYaml(draft), options.out);
      const treatments = plain.scenario.catalogue.treatments;
      const sites = plain.scenario.sites.map(
        (site): SiteCandidateChoice => (options.suggestAll === true || site.candidates.length === 0 ? { site, suggestions: suggestCandidates(site, treatments, maxSuggestions) } : { site }),
      );
      const text = initScenarioYaml({ ...draft, crashWindow: plain.scenario.crashWindow, sites });
      let written: LoadedScenario;
      try {
        written = load(text, options.out);
      } catch (error) {
        // The inputs loaded, so a failure here is in what init wrote, not in the user's files.
        if (error instanceof InputError) throw new Error(`init composed a scenario that does not load: ${error.message}`);
        throw error;
      }
      writeOutputFile(options.out, text, options.force === true);

      const suggested = sites.filter((choice) => choice.suggestions !== undefined && choice.suggestions.length > 0).length;
      const kept = sites.filter((choice) => (choice.suggestions?.length ?? 0) === 0 && choice.site.candidates.length > 0).length;
      const none = noCandidatesText(sitesWithoutCandidates(written.scenario.sites));
      io.stderr(
        [
          `wrote ${options.out}: ${sites.length} sites from ${options.sites}, ${treatments.length} treatments in ${options.catalogue.length} catalogue(s), budget ${formatMoney(budget)} ${options.currency}`,
          ...(suggested > 0 ? [`suggested candidates for ${suggested} site(s), up to ${maxSuggestions} each, under siteCandidates: an engineer should review them before planning`] : []),
          ...(kept > 0 ? [`${kept} site(s) keep the candidates their sites file lists${options.suggestAll === true ? "" : " (--suggest-all suggests for them too)"}`] : []),
          ...(none !== undefined ? [`${none}.`] : []),
          ...(options.currency !== DEFAULT_ECONOMICS.crashCostsCurrency ? [`warning: the unit crash costs are in ${DEFAULT_ECONOMICS.crashCostsCurrency}; replace them with unit costs in ${options.currency} (economics.crashCosts)`] : []),
          `next: averta check ${options.out}`,
        ].join("\n") + "\n",
      );
    });
}

function load(text: string, file: string): LoadedScenario {
  return loadScenarioSource(parseYamlText(text, file), file);
}

/** Refuses an --out that is one of this run's inputs, even with --force. */
function refuseInputAsOutput(out: string, inputs: readonly (readonly [string, string])[]): void {
  const target = realPath(resolve(out));
  for (const [option, file] of inputs) {
    if (realPath(resolve(file)) === target) {
      throw new InputError([{ code: "bad-option", file: "--out", message: `names the same file as ${option} (${file}); an input is never overwritten`, hint: "give --out a new file name, e.g. --out scenario.yaml" }]);
    }
  }
}

/**
 * How the new scenario names an input file: relative to the scenario's folder when the path
 * policy allows it (inside that folder, or a catalogs folder above), else absolute.
 */
function scenarioPath(out: string, file: string): string {
  const resolved = resolve(file);
  return allowedInputPath(out, resolved) ? pathFrom(out, resolved) : resolved.split(sep).join("/");
}

/** `target` relative to the folder of `file`, with forward slashes as YAML files use. */
function pathFrom(file: string, target: string): string {
  const path = relative(dirname(resolve(file)), target);
  return isAbsolute(path) ? path : path.split(sep).join("/");
}

function realPath(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    return path;
  }
}
