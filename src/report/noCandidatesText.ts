/** Ids named in full before the rest are counted. */
const LISTED = 10;

/**
 * The sentence every plan and screening output carries when some sites have no candidate
 * treatments, e.g. "2 sites have no candidate treatments and cannot be funded: I-07, S-02";
 * undefined when every site has some.
 */
export function noCandidatesText(siteIds: readonly string[]): string | undefined {
  if (siteIds.length === 0) return undefined;
  const count = siteIds.length === 1 ? "1 site has" : `${siteIds.length} sites have`;
  const more = siteIds.length > LISTED ? ` and ${siteIds.length - LISTED} more` : "";
  return `${count} no candidate treatments and cannot be funded: ${siteIds.slice(0, LISTED).join(", ")}${more}`;
}
