import { crashCellsText } from "../model/crashCellsText.js";
import type { LocalCmf } from "../model/effectEvidenceTypes.js";
import { matchEffectCells, type CrashCells } from "../model/matchEffectCells.js";
import { poolEffectEvidence } from "../model/poolEffectEvidence.js";
import { hasStandardError } from "../model/sampleTreatmentCmfs.js";
import type { Catalogue, Effect, Treatment } from "../model/types.js";
import { closestName } from "./closestName.js";
import type { InputProblem } from "./InputError.js";
import type { LoadedCatalogue } from "./loadCatalogue.js";

/** A scenario's catalogues as one, with their local evidence applied, and what could not be applied. */
export interface AppliedLocalEvidence {
  readonly catalogue: Catalogue;
  /** Local evidence that names no treatment, or covers an effect's cells only in part: errors. */
  readonly problems: readonly InputProblem[];
  /** Local evidence left unpooled because the published effect has no standard error. */
  readonly warnings: readonly InputProblem[];
}

/** The local entries on one block of cells of one treatment: on an effect's exact cells, or on new ones. */
interface Group {
  readonly cells: CrashCells;
  /** Index of the treatment's effect on exactly these cells; absent for cells no effect covers. */
  readonly effectIndex?: number;
  readonly local: LocalCmf[];
  /** Where the first entry of the group is, for an entry that overlaps it in part. */
  readonly firstAt: string;
}

/**
 * Merges the catalogues in order and applies every `localEvidence:` entry to the treatment it
 * names, wherever that is defined: entries on exactly one effect's crash cells pool with it (and
 * with each other), entries on cells no effect touches become one new effect, both by
 * poolEffectEvidence. Runs once all catalogues are loaded, so a local-evidence file can follow
 * the published catalogue in `catalogues:`. An entry that overlaps an effect (or another new
 * entry) only in part would make two CMFs claim one crash cell, so it is an error.
 */
export function applyLocalEvidence(catalogues: readonly LoadedCatalogue[]): AppliedLocalEvidence {
  const problems: InputProblem[] = [];
  const warnings: InputProblem[] = [];
  const defined = new Map<string, { treatment: Treatment; file: string }>();
  for (const loaded of catalogues) for (const treatment of loaded.catalogue.treatments) if (!defined.has(treatment.id)) defined.set(treatment.id, { treatment, file: loaded.source.file });
  const groups = new Map<string, Group[]>();

  for (const loaded of catalogues) {
    loaded.localEvidence.forEach((entry, index) => {
      const at = (field?: string) => ({
        file: loaded.source.file,
        ...loaded.source.positionOf(field === undefined ? ["localEvidence", index] : ["localEvidence", index, field]),
        path: `localEvidence[${index}]${field === undefined ? "" : `.${field}`}`,
      });
      const here = `${loaded.source.file} localEvidence[${index}]`;
      const found = defined.get(entry.treatment);
      if (found === undefined) {
        const guess = closestName(entry.treatment, defined.keys());
        problems.push({ code: "unknown-id", ...at("treatment"), message: `local evidence for unknown treatment '${entry.treatment}'`, hint: guess ? `did you mean '${guess}'?` : "name a treatment defined in a catalogue listed in the scenario's catalogues" });
        return;
      }
      const { treatment, file } = found;
      const own = groups.get(treatment.id) ?? [];
      groups.set(treatment.id, own);
      const match = matchEffectCells(treatment.effects, entry);
      if (match.kind === "partial") {
        const effect = treatment.effects[match.index]!;
        problems.push({
          code: "local-evidence-overlap",
          ...at("crashTypes"),
          message: `local evidence for '${treatment.id}' on ${crashCellsText(entry)} overlaps its effect on ${crashCellsText(effect)} (${file}) without covering exactly the same crashes, so two CMFs would claim some of them`,
          hint: `evaluate the same crash group as the published effect (${crashCellsText(effect)}), or crashes none of its effects covers`,
        });
        return;
      }
      const newCells = match.kind === "none" ? matchEffectCells(own.map((group) => group.cells), entry) : undefined;
      if (newCells?.kind === "partial") {
        problems.push({
          code: "local-evidence-overlap",
          ...at("crashTypes"),
          message: `local evidence for '${treatment.id}' on ${crashCellsText(entry)} overlaps the local evidence at ${own[newCells.index]!.firstAt} (${crashCellsText(own[newCells.index]!.cells)}) without covering exactly the same crashes, so two CMFs would claim some of them`,
          hint: "give local estimates on the same crashes the same crashTypes and severities, so they pool, or make them cover separate crashes",
        });
        return;
      }
      const group =
        match.kind === "same"
          ? own.find((candidate) => candidate.effectIndex === match.index)
          : newCells?.kind === "same"
            ? own[newCells.index]
            : undefined;
      const local: LocalCmf = { cmf: entry.cmf, standardError: entry.standardError, source: entry.source };
      if (group?.local.some((other) => other.cmf === local.cmf && other.standardError === local.standardError && other.source === local.source)) {
        // Pooling one estimate twice would halve its variance: a pasted copy of a listed file, most likely.
        problems.push({ code: "local-evidence-repeated", ...at(), message: `this local evidence for '${treatment.id}' on ${crashCellsText(entry)} is listed again (first at ${group.firstAt})`, hint: "list each estimate once: pooling assumes independent estimates" });
        return;
      }
      if (group !== undefined) group.local.push(local);
      const published = match.kind === "same" ? treatment.effects[match.index]! : undefined;
      // Pooled effects keep the published effect's cells as written there.
      const cells = published ?? entry;
      if (group === undefined) own.push({ cells: { crashTypes: cells.crashTypes, severities: cells.severities }, ...(match.kind === "same" && { effectIndex: match.index }), local: [local], firstAt: here });
      if (published !== undefined && !hasStandardError(published)) {
        warnings.push({
          code: "local-evidence-unpooled",
          ...at(),
          message: `the published CMF ${published.cmf} of '${treatment.id}' on ${crashCellsText(published)} (${file}) has no standard error, so this local CMF ${entry.cmf} (SE ${entry.standardError}) cannot be weighted against it: the published CMF is used as is`,
          hint: `add the published standardError to that effect in ${file} to pool them`,
        });
      }
    });
  }

  const treatments = catalogues.flatMap((loaded) => loaded.catalogue.treatments).map((treatment) => {
    const own = groups.get(treatment.id);
    if (own === undefined || own.length === 0 || defined.get(treatment.id)?.treatment !== treatment) return treatment;
    return { ...treatment, effects: withEvidence(treatment.effects, own) };
  });
  return { catalogue: { treatments, performanceFunctions: catalogues.flatMap((loaded) => loaded.catalogue.performanceFunctions) }, problems, warnings };
}

/** The effects with each group's evidence pooled in, and the groups on new cells appended (they touch no effect, so order is free). */
function withEvidence(effects: readonly Effect[], groups: readonly Group[]): Effect[] {
  const pooled = effects.map((effect, index) => {
    const group = groups.find((candidate) => candidate.effectIndex === index);
    return group === undefined ? effect : poolEffectEvidence({ ...group.cells, published: effect, local: group.local });
  });
  const added = groups.filter((group) => group.effectIndex === undefined).map((group) => poolEffectEvidence({ ...group.cells, local: group.local }));
  return [...pooled, ...added];
}
