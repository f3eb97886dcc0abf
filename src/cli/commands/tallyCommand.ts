import type { Command } from "commander";
import { basename } from "node:path";
import { DEFAULT_ASSIGN_OPTIONS } from "../../geo/assignCrashes.js";
import { FULL_YEAR_SHARE, MIN_WINDOW_ROW_SHARE, type WindowInference } from "../../geo/inferCrashWindow.js";
import { tallyNetwork, type CrashDataQuality, type CrashWindow } from "../../geo/tallyNetwork.js";
import { checkUnknownCodes } from "../../io/checkUnknownCodes.js";
import { DEFAULT_CRASH_MAPPING } from "../../io/CrashMapping.js";
import { InputError } from "../../io/InputError.js";
import { readCrashCsv } from "../../io/readCrashCsv.js";
import { readCrashMapping } from "../../io/readCrashMapping.js";
import { DATE_FORMATS, type DateFormat } from "../../io/parseCrashDate.js";
import type { CsvDelimiter } from "../../io/parseCsv.js";
import { readSitesGeojson } from "../../io/readSitesGeojson.js";
import { checkOutputTarget } from "../../io/writeOutputFile.js";
import { writeOutputFiles } from "../../io/writeOutputFiles.js";
import { crashQualityText } from "../../report/crashQualityText.js";
import { sitesJsonForm } from "../../report/sitesJsonForm.js";
import { sitesYaml } from "../../report/sitesYaml.js";
import type { CliIo } from "../CliIo.js";

interface TallyOptions {
  crashes: string;
  sites: string;
  window?: string;
  mapping?: string;
  dateFormat?: string;
  delimiter?: string;
  out: string;
  force?: boolean;
  jsonForm?: boolean;
  radius: string;
  buffer: string;
}

/** Terminal lists of bad rows stop here; the saved report has them all. */
const LISTED_ON_TERMINAL = 20;

/** `averta tally`: count geolocated crashes by site and write a scenario's sites block. */
export function registerTallyCommand(program: Command, io: CliIo): void {
  program
    .command("tally")
    .description("assign geolocated crashes to sites and write the sites block of a scenario, with a data-quality report")
    .requiredOption("--crashes <file>", "crash records, CSV (RFC 4180, UTF-8; comma, semicolon or tab) with id, date, latitude, longitude, severity, type")
    .requiredOption("--sites <file>", "sites, GeoJSON FeatureCollection: Points (intersections), LineStrings (segments, corridors)")
    .option("--window <years>", "crash years to count, e.g. 2021-2025 (default: the latest run of full years in the data)")
    .option("--mapping <file>", "YAML mapping of column names and agency codes (columns:, severity:, type:)")
    .option("--date-format <order>", "how dates are written: ymd (2024-03-31, ISO date-time), dmy (31/03/2024, 31.03.2024) or mdy (03/31/2024) (default: told from the dates)")
    .option("--delimiter <separator>", "field separator: ',' ';' or tab (default: told from the header)")
    .option("-o, --out <file>", "sites YAML to write; the report goes beside it as <out>.quality.txt", "scenario-sites.yaml")
    .option("--json-form", "write the sites file in YAML's JSON form, one site per line: it loads far faster (for thousands of sites)")
    .option("--force", "replace the output files if they exist")
    .option("--radius <metres>", "influence radius of an intersection", String(DEFAULT_ASSIGN_OPTIONS.intersectionRadiusM))
    .option("--buffer <metres>", "buffer either side of a segment or corridor", String(DEFAULT_ASSIGN_OPTIONS.segmentBufferM))
    .action((options: TallyOptions) => {
      const window = options.window === undefined ? undefined : parseWindow(options.window);
      const dateFormat = options.dateFormat === undefined ? undefined : parseDateFormat(options.dateFormat);
      const delimiter = options.delimiter === undefined ? undefined : parseDelimiter(options.delimiter);
      const intersectionRadiusM = parseMetres("--radius", options.radius);
      const segmentBufferM = parseMetres("--buffer", options.buffer);
      const qualityFile = `${options.out}.quality.txt`;
      // Checked before reading, so a refusal costs nothing on a large crash file.
      checkOutputTarget(options.out, options.force === true);
      checkOutputTarget(qualityFile, options.force === true);
      const mapping = options.mapping === undefined ? DEFAULT_CRASH_MAPPING : readCrashMapping(options.mapping);
      const sites = readSitesGeojson(options.sites);
      const rows = readCrashCsv(options.crashes, mapping, { ...(dateFormat && { dateFormat }), ...(delimiter && { delimiter }) });
      const codeWarnings = checkUnknownCodes(rows, options.crashes);
      const { sites: tallied, quality } = tallyNetwork(sites, rows, window, { intersectionRadiusM, segmentBufferM });
      if (quality.windowInference !== undefined && !quality.windowInference.clear) {
        throw new InputError([{ code: "window-unclear", file: options.crashes, message: unclearWindow(quality.windowInference), hint: "pass --window FIRST-LAST, e.g. --window 2021-2025; nothing was written" }]);
      }
      const inputs = { crashes: options.crashes, sites: options.sites };
      const provenance = `Written by averta tally from ${basename(options.crashes)} and ${basename(options.sites)} (radius ${intersectionRadiusM} m, buffer ${segmentBufferM} m).`;
      const report = crashQualityText(quality, inputs);
      if (quality.rowsRead > 0 && quality.assigned === 0) {
        // Every count would be zero: almost always a wrong column mapping, swapped coordinates,
        // a window that misses the data, or files from two different places. Write nothing.
        io.stderr(crashQualityText(quality, inputs, LISTED_ON_TERMINAL));
        throw new InputError([{ code: "nothing-assigned", file: options.crashes, message: noneAssigned(quality), hint: "check the --mapping columns (latitude and longitude not swapped or mis-mapped), --window, and that --crashes and --sites cover the same area; nothing was written" }]);
      }
      writeOutputFiles([{ path: options.out, content: (options.jsonForm === true ? sitesJsonForm : sitesYaml)(tallied, quality.window, provenance) }, { path: qualityFile, content: report }], options.force === true);
      io.stderr(crashQualityText(quality, inputs, LISTED_ON_TERMINAL, qualityFile));
      for (const warning of codeWarnings) io.stderr(`${warning}\n`);
      if (quality.windowInference !== undefined) {
        const { window: inferred, leftOutRows, leftOut } = quality.windowInference;
        const { firstYear, lastYear } = inferred;
        const left = leftOutRows === 0 ? "no rows left out" : `${leftOutRows} row${leftOutRows === 1 ? "" : "s"} from ${leftOut.map((entry) => entry.year).join(", ")} left out`;
        io.stderr(`note: the window ${firstYear}-${lastYear} (${lastYear - firstYear + 1} years) was taken from the data; pass --window to fix it (it is the latest run of full years: ${left})\n`);
      }
      io.stderr(`wrote ${options.out} (${tallied.length} sites) and ${qualityFile}\n`);
    });
}

/** Where the rows went when none reached a site, in plain words. */
function noneAssigned(quality: CrashDataQuality): string {
  const reasons = Object.entries(quality.rejectedByReason).filter(([, count]) => count > 0).map(([reason, count]) => `${count} ${reason}`);
  const parts = [
    quality.unassigned > 0 ? `${quality.unassigned} unassigned (${quality.outsideExtent} outside the sites' extent)` : undefined,
    reasons.length > 0 ? `${quality.rejected.length} rejected (${reasons.join(", ")})` : undefined,
  ].filter((part) => part !== undefined);
  return `none of the ${quality.rowsRead} crash rows was assigned to a site: ${parts.join("; ")}`;
}

/** Why the years of the data give no clear window, with the rows of each year. */
function unclearWindow(inference: WindowInference): string {
  const { firstYear, lastYear } = inference.window;
  const years = inference.rowsByYear.map((entry) => `${entry.year}: ${entry.rows}`).join(", ");
  return `the crash years give no clear window: the latest run of full years (each with at least ${100 * FULL_YEAR_SHARE}% of the median year's ${inference.medianYearRows} rows), ${firstYear}-${lastYear}, holds ${(100 * inference.windowShare).toFixed(1)}% of the dated rows, under the ${100 * MIN_WINDOW_ROW_SHARE}% needed; rows by year: ${years}`;
}

function parseDateFormat(text: string): DateFormat {
  const format = text.trim().toLowerCase();
  if (!(DATE_FORMATS as readonly string[]).includes(format)) {
    throw new InputError([{ code: "bad-option", file: "--date-format", message: `'${text}' is not a date format`, hint: "use ymd (2024-03-31, or an ISO date-time), dmy (31/03/2024, 31-03-2024, 31.03.2024) or mdy (03/31/2024)" }]);
  }
  return format as DateFormat;
}

function parseDelimiter(text: string): CsvDelimiter {
  const byName: Readonly<Record<string, CsvDelimiter>> = { ",": ",", comma: ",", ";": ";", semicolon: ";", tab: "\t", "\\t": "\t", "\t": "\t" };
  const delimiter = byName[text.toLowerCase()];
  if (delimiter === undefined) {
    throw new InputError([{ code: "bad-option", file: "--delimiter", message: `'${text}' is not a field separator`, hint: "use --delimiter ',' (comma), ';' (semicolon) or tab; quote ';' in the shell" }]);
  }
  return delimiter;
}

function parseWindow(text: string): CrashWindow {
  const match = /^\s*(\d{4})\s*-\s*(\d{4})\s*$/.exec(text);
  const firstYear = Number(match?.[1]);
  const lastYear = Number(match?.[2]);
  if (!match || lastYear < firstYear) {
    throw new InputError([{ code: "bad-option", file: "--window", message: `'${text}' is not a range of years`, hint: "write it as 2021-2025, earliest year first" }]);
  }
  return { firstYear, lastYear };
}

function parseMetres(option: string, text: string): number {
  const value = Number(text);
  if (!(text.trim() !== "" && Number.isFinite(value) && value >= 0 && value <= 1000)) {
    throw new InputError([{ code: "bad-option", file: option, message: `'${text}' is not a distance from 0 to 1000 metres`, hint: `give ${option} in metres, e.g. 50` }]);
  }
  return value;
}
