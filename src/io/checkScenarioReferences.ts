import type { Treatment } from "../model/types.js";
import { closestName } from "./closestName.js";
import { formatFieldPath } from "./fieldPath.js";
import type { InputProblem } from "./InputError.js";
import type { LoadedCatalogue } from "./loadCatalogue.js";
import type { RawScenario } from "./loadScenario.js";
import { candidatesPath } from "./loadScenarioSites.js";
import { checkAmount, checkProgrammeBlock } from "./checkProgrammeBlock.js";
import type { PathSegment, YamlSource } from "./readYamlFile.js";

/**
 * Checks what a schema cannot: ids that must exist and be unique, treatments that must suit the
 * site, rules that must name real sites and districts, and values that must agree with each other.
 */
export function checkScenarioReferences(
  raw: RawScenario,
  source: YamlSource,
  catalogues: readonly LoadedCatalogue[],
  sitesSource: YamlSource = source,
): InputProblem[] {
  const problems: InputProblem[] = [];
  // A path into sites[…] is in the sites file when the scenario names one.
  const problem = (code: string, path: PathSegment[], message: string, hint?: string, key = false) => {
    const at = path[0] === "sites" ? sitesSource : source;
    problems.push({ code, file: at.file, ...at.positionOf(path, key), path: formatFieldPath(path), message, ...(hint && { hint }) });
  };

  const treatments = new Map<string, Treatment>();
  for (const loaded of catalogues) {
    loaded.catalogue.treatments.forEach((treatment, index) => {
      if (treatments.has(treatment.id)) {
        problems.push({
          code: "duplicate-id",
          file: loaded.source.file,
          ...loaded.source.positionOf(["treatments", index, "id"]),
          path: `treatments[${index}].id`,
          message: `treatment id '${treatment.id}' is also defined in another catalogue of this scenario`,
          hint: "rename one of them, or drop one catalogue",
        });
      }
      treatments.set(treatment.id, treatment);
    });
  }
  const performanceFunctions = new Set(catalogues.flatMap((loaded) => loaded.catalogue.performanceFunctions.map((spf) => spf.id)));

  if (raw.crashWindow.lastYear < raw.crashWindow.firstYear) {
    problem("window-reversed", ["crashWindow"], `the crash window ends (${raw.crashWindow.lastYear}) before it starts (${raw.crashWindow.firstYear})`, "swap firstYear and lastYear");
  }
  checkProgrammeBlock(raw, treatments, problem);
  for (const severity of ["K", "A", "B", "C", "O"] as const) checkAmount(raw.economics.crashCosts[severity], ["economics", "crashCosts", severity], problem);
  const ksiCosting = raw.economics.ksiCosting;
  if (ksiCosting?.unitCost !== undefined) checkAmount(ksiCosting.unitCost, ["economics", "ksiCosting", "unitCost"], problem);
  if (ksiCosting?.method === "by-severity" && (ksiCosting.unitCost !== undefined || ksiCosting.fatalShare !== undefined)) {
    problem("rule-conflict", ["economics", "ksiCosting"], "unitCost and fatalShare only apply when method is 'combined'", "set method: combined, or remove them");
  }
  if (ksiCosting?.unitCost !== undefined && ksiCosting.fatalShare !== undefined) {
    problem("rule-conflict", ["economics", "ksiCosting"], "give either a combined unitCost or a fatalShare to weight the K and A costs, not both", "keep one of the two");
  }
  const escalation = raw.economics.crashCosts.escalation;
  if (escalation !== undefined && raw.economics.crashCosts.priceYear === undefined) {
    problem("missing-price-year", ["economics", "crashCosts", "escalation"], "escalation needs the crash costs' own price year", "add crashCosts.priceYear (the year the unit costs are in)");
  }
  if (escalation !== undefined && "annualRate" in escalation && raw.economics.priceYear === undefined) {
    problem("missing-price-year", ["economics", "crashCosts", "escalation"], "escalation at an annual rate needs the programme's price year", "add economics.priceYear (the year capital costs and the budget are in)");
  }

  const siteIndex = new Map<string, number>();
  const districts = new Set<string>();
  const tags = new Set<string>();
  raw.sites.forEach((site, index) => {
    const earlier = siteIndex.get(site.id);
    if (earlier !== undefined) {
      problem("duplicate-id", ["sites", index, "id"], `site id '${site.id}' is used twice (first at sites[${earlier}])`, "give each site its own id");
    } else siteIndex.set(site.id, index);
    districts.add(site.district);
    for (const tag of site.tags ?? []) tags.add(tag);

    site.candidates.forEach((id, candidateIndex) => {
      const path: PathSegment[] = [...candidatesPath(raw, index), candidateIndex];
      const treatment = treatments.get(id);
      if (!treatment) {
        const guess = closestName(id, treatments.keys());
        problem("unknown-id", path, `unknown treatment '${id}'`, guess ? `did you mean '${guess}'?` : "add it to a catalogue, or check the catalogue list");
        return;
      }
      if (!treatment.appliesTo.includes(site.kind)) {
        problem("not-applicable", path, `treatment '${id}' does not apply to ${site.kind === "intersection" ? "an" : "a"} ${site.kind}`, `it applies to: ${treatment.appliesTo.join(", ")}`);
      }
      if (site.area !== undefined && treatment.appliesToAreas !== undefined && !treatment.appliesToAreas.includes(site.area)) {
        problem("not-applicable", path, `treatment '${id}' is meant for ${treatment.appliesToAreas.join(" or ")} roads, and site '${site.id}' is ${site.area}`, "drop it from this site's candidates, or correct the site's area");
      }
      if (treatment.cost.basis === "per-km" && site.lengthKm === undefined) {
        problem("missing-length", ["sites", index], `treatment '${id}' is costed per km but site '${site.id}' has no lengthKm`, "add lengthKm to the site");
      }
    });
    for (const [id, value] of Object.entries(site.costOverrides ?? {})) {
      const path: PathSegment[] = ["sites", index, "costOverrides", id];
      if (!site.candidates.includes(id)) problem("unknown-id", path, `cost override for '${id}', which is not a candidate at this site`, "add it to candidates or remove the override", true);
      checkAmount(value, path, problem);
    }
    if (site.performanceFunction !== undefined && !performanceFunctions.has(site.performanceFunction)) {
      const guess = closestName(site.performanceFunction, performanceFunctions);
      problem("unknown-id", ["sites", index, "performanceFunction"], `unknown performance function '${site.performanceFunction}'`, guess ? `did you mean '${guess}'?` : "define it under performanceFunctions in a catalogue");
    }
  });

  Object.keys(raw.calibration ?? {}).forEach((id) => {
    if (!performanceFunctions.has(id)) {
      const guess = closestName(id, performanceFunctions);
      problem("unknown-id", ["calibration", id], `unknown performance function '${id}'`, guess ? `did you mean '${guess}'?` : "calibrate a performance function defined in a catalogue", true);
    }
  });

  const rules = raw.rules ?? {};
  const mustFundSites = new Set<string>();
  for (const listName of ["mustFund", "neverFund"] as const) {
    (rules[listName] ?? []).forEach((rule, index) => {
      const path: PathSegment[] = ["rules", listName, index];
      const at = siteIndex.get(rule.site);
      if (at === undefined) {
        const guess = closestName(rule.site, siteIndex.keys());
        problem("unknown-id", [...path, "site"], `unknown site '${rule.site}'`, guess ? `did you mean '${guess}'?` : "use a site id from sites");
        return;
      }
      const site = raw.sites[at]!;
      (rule.treatments ?? []).forEach((id, treatmentIndex) => {
        if (!site.candidates.includes(id)) {
          problem("unknown-id", [...path, "treatments", treatmentIndex], `'${id}' is not a candidate at site '${site.id}'`, site.candidates.length > 0 ? `candidates there: ${site.candidates.join(", ")}` : "the site has no candidate treatments yet");
        }
      });
      if (listName === "mustFund") {
        if (mustFundSites.has(rule.site)) problem("duplicate-id", [...path, "site"], `site '${rule.site}' is listed twice under mustFund`, "merge the two entries");
        mustFundSites.add(rule.site);
        const chosen = (rule.treatments ?? []).map((id) => treatments.get(id)).filter((t): t is Treatment => t !== undefined);
        const groups = chosen.map((t) => t.exclusiveGroup).filter((g): g is string => g !== undefined);
        if (new Set(groups).size < groups.length) problem("rule-conflict", path, `must-fund treatments at '${rule.site}' share an exclusive group, so they can never be combined`, "keep one treatment of each exclusive group");
        if (chosen.length > (raw.maxTreatmentsPerSite ?? 3)) problem("rule-conflict", path, `must-fund names ${chosen.length} treatments, more than maxTreatmentsPerSite`, "raise maxTreatmentsPerSite or name fewer treatments");
      } else if (mustFundSites.has(rule.site) && (rule.treatments ?? []).length === 0) {
        problem("rule-conflict", path, `site '${rule.site}' is both must-fund and never-fund`, "remove one of the two rules");
      }
    });
  }

  const checkSelector = (path: PathSegment[], rule: { district?: string; tag?: string }) => {
    if (rule.district !== undefined && rule.tag !== undefined) problem("rule-selector", path, "a rule names both a district and a tag", "name one of them (or neither, for all sites)");
    if (rule.district !== undefined && !districts.has(rule.district)) {
      const guess = closestName(rule.district, districts);
      problem("unknown-id", [...path, "district"], `no site is in district '${rule.district}'`, guess ? `did you mean '${guess}'?` : `districts: ${[...districts].join(", ")}`);
    }
    if (rule.tag !== undefined && !tags.has(rule.tag)) {
      const guess = closestName(rule.tag, tags);
      problem("unknown-id", [...path, "tag"], `no site has tag '${rule.tag}'`, guess ? `did you mean '${guess}'?` : "add the tag to some sites or fix its spelling");
    }
  };
  for (const listName of ["spendCaps", "spendFloors"] as const) {
    (rules[listName] ?? []).forEach((rule, index) => {
      const path: PathSegment[] = ["rules", listName, index];
      checkSelector(path, rule);
      if ((rule.amount === undefined) === (rule.share === undefined)) problem("rule-amount", path, "a spending rule needs exactly one of 'amount' or 'share'", "write amount: 1.2M, or share: 0.3");
      if (rule.amount !== undefined) checkAmount(rule.amount, [...path, "amount"], problem);
    });
  }
  (rules.ksiShareFloors ?? []).forEach((rule, index) => checkSelector(["rules", "ksiShareFloors", index], rule));
  (rules.maxProjects ?? []).forEach((rule, index) => checkSelector(["rules", "maxProjects", index], rule));
  return problems;
}
