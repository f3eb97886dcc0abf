/**
 * LibreOffice Calc as an independent spreadsheet engine: tests hand it the workbooks exceljs writes,
 * so formulas are evaluated and files re-saved by a second implementation, not by our own code.
 * Each call runs its own soffice with its own throwaway profile, so calls may run in parallel.
 */
import { execFile } from "node:child_process";
import { existsSync } from "node:fs";
import { copyFile, mkdir, mkdtemp, readFile, readdir, rm, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { pathToFileURL } from "node:url";
import { parseCsv } from "../parseCsv.js";

export const SOFFICE = "/usr/bin/soffice";
export const libreOfficePresent = existsSync(SOFFICE);

const TIMEOUT_MS = 120_000;
// The input is copied under this name so output names are predictable and no lock file lands beside it.
const BOOK = "book";

/**
 * Tokens of the CSV filter options (LibreOffice help, "CSV Filter Options"; meanings checked here by trial):
 * 1 separator 44 (,), 2 text delimiter 34 ("), 3 charset 76 (UTF-8), 4 first line 1, 5 column formats
 * (import only, empty), 6 language 0, 7 quote all text false, 8 true = numbers unquoted (false quotes them),
 * 9 save cell contents as shown false (the raw value, not the number format's rounding),
 * 10 export formulas false (their results instead), 11 remove spaces false, 12 sheet -1 = every sheet,
 * each written to "<base>-<SheetName>.csv".
 */
export const CSV_FILTER = "Text - txt - csv (StarCalc):44,34,76,1,,0,false,true,false,false,false,-1";
const XLSX_FILTER = "Calc Office Open XML";

/**
 * Profile settings: OOXMLRecalcMode 0 = always recalculate on load (the default keeps the file's cached
 * results, which would only echo what exceljs wrote); locale en-US so numbers use a decimal point
 * whatever the machine's locale.
 */
const REGISTRY = `<?xml version="1.0" encoding="UTF-8"?>
<oor:items xmlns:oor="http://openoffice.org/2001/registry" xmlns:xs="http://www.w3.org/2001/XMLSchema" xmlns:xsi="http://www.w3.org/2001/XMLSchema-instance">
<item oor:path="/org.openoffice.Office.Calc/Formula/Load"><prop oor:name="OOXMLRecalcMode" oor:op="fuse"><value>0</value></prop></item>
<item oor:path="/org.openoffice.Setup/L10N"><prop oor:name="ooSetupSystemLocale" oor:op="fuse"><value>en-US</value></prop></item>
</oor:items>
`;

/**
 * Every sheet of the workbook after LibreOffice recalculated all formulas, as CSV rows keyed by sheet
 * name (sorted by name, not workbook order). Numbers carry LibreOffice's 15 significant digits.
 */
export async function recalculatedSheets(xlsxPath: string): Promise<Map<string, string[][]>> {
  return withWorkspace(xlsxPath, async (folder, book, out) => {
    const stderr = await runSoffice(folder, ["--convert-to", `csv:${CSV_FILTER}`, "--outdir", out, book]);
    const prefix = `${BOOK}-`;
    const files = (await readdir(out)).filter((name) => name.startsWith(prefix) && name.endsWith(".csv")).sort();
    if (files.length === 0) throw new Error(`soffice wrote no CSV sheets for ${xlsxPath}: ${stderr}`);
    const sheets = new Map<string, string[][]>();
    for (const file of files) {
      sheets.set(file.slice(prefix.length, -".csv".length), parseCsv(await readFile(join(out, file), "utf8")));
    }
    return sheets;
  });
}

/** Opens the workbook in LibreOffice and saves it again as xlsx at outPath. */
export async function resavedXlsx(xlsxPath: string, outPath: string): Promise<void> {
  await withWorkspace(xlsxPath, async (folder, book, out) => {
    const stderr = await runSoffice(folder, ["--convert-to", `xlsx:${XLSX_FILTER}`, "--outdir", out, book]);
    const written = join(out, `${BOOK}.xlsx`);
    if (!existsSync(written)) throw new Error(`soffice did not re-save ${xlsxPath} as xlsx: ${stderr}`);
    await copyFile(written, outPath);
  });
}

/** A fresh folder holding the profile, a copy of the input and an output folder; removed afterwards. */
async function withWorkspace<T>(xlsxPath: string, work: (folder: string, book: string, out: string) => Promise<T>): Promise<T> {
  const folder = await mkdtemp(join(tmpdir(), "averta-libreoffice-"));
  try {
    await mkdir(join(folder, "profile", "user"), { recursive: true });
    await writeFile(join(folder, "profile", "user", "registrymodifications.xcu"), REGISTRY);
    const book = join(folder, `${BOOK}.xlsx`);
    await copyFile(xlsxPath, book);
    const out = join(folder, "out");
    await mkdir(out);
    return await work(folder, book, out);
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}

/** Runs soffice headless on the folder's own profile; resolves with its stderr for later messages. */
function runSoffice(folder: string, args: string[]): Promise<string> {
  const profile = `-env:UserInstallation=${pathToFileURL(join(folder, "profile")).href}`;
  return new Promise((resolve, reject) => {
    execFile(
      SOFFICE,
      ["--headless", "--norestore", "--nologo", profile, ...args],
      { cwd: folder, timeout: TIMEOUT_MS },
      (error, _stdout, stderr) => {
        if (error) reject(new Error(`soffice failed (${error.message.split("\n")[0]}): ${stderr}`));
        else resolve(stderr);
      },
    );
  });
}
