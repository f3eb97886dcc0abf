import type { SiteAlternatives } from "../model/buildAlternatives.js";
import type { Alternative } from "../model/types.js";

/** One funded project: a site and the alternative chosen there. */
export interface FundedProject {
  readonly entry: SiteAlternatives;
  readonly alternative: Alternative;
  /** Index of the alternative within its site's alternatives. */
  readonly index: number;
}
