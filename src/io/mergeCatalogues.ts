import type { Catalogue } from "../model/types.js";
import type { InputProblem } from "./InputError.js";
import type { LoadedCatalogue } from "./loadCatalogue.js";

/** Listed catalogues as one, and the ids that two of them both define. */
export interface MergedCatalogues {
  readonly catalogue: Catalogue;
  /** A treatment or SPF id defined again in a later catalogue, located there. */
  readonly problems: readonly InputProblem[];
}

/**
 * Merges the catalogues a file lists, in order, as a scenario merges them. An id defined in two
 * catalogues is a problem: which treatment (or SPF) the file means would depend on the order.
 */
export function mergeCatalogues(catalogues: readonly LoadedCatalogue[]): MergedCatalogues {
  const problems: InputProblem[] = [];
  const lists = [
    { field: "treatments", what: "treatment", ids: (loaded: LoadedCatalogue) => loaded.catalogue.treatments.map((treatment) => treatment.id) },
    { field: "performanceFunctions", what: "performance function", ids: (loaded: LoadedCatalogue) => loaded.catalogue.performanceFunctions.map((spf) => spf.id) },
  ];
  for (const { field, what, ids } of lists) {
    const seen = new Set<string>();
    for (const loaded of catalogues) {
      ids(loaded).forEach((id, index) => {
        if (seen.has(id)) {
          problems.push({
            code: "duplicate-id",
            file: loaded.source.file,
            ...loaded.source.positionOf([field, index, "id"]),
            path: `${field}[${index}].id`,
            message: `${what} id '${id}' is also defined in another catalogue listed with this one`,
            hint: "rename one of them, or drop one catalogue",
          });
        }
      });
      for (const id of ids(loaded)) seen.add(id);
    }
  }
  return {
    catalogue: {
      treatments: catalogues.flatMap((loaded) => loaded.catalogue.treatments),
      performanceFunctions: catalogues.flatMap((loaded) => loaded.catalogue.performanceFunctions),
    },
    problems,
  };
}
