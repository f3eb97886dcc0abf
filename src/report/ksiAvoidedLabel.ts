/**
 * The label for what averta counts and maximises: crashes of KABCO severity K or A avoided. KSI
 * here means K+A *crashes*, not people killed or seriously injured, so labels say so.
 */
export const KSI_AVOIDED_LABEL = "K+A crashes avoided";

/** What every `ksiAvoided` figure means, for JSON `definitions` and the reports' assumptions. */
export const KSI_AVOIDED_DEFINITION =
  "K+A crashes avoided (KSI crashes): expected crashes of KABCO severity K (fatal) or A (suspected serious injury) avoided, summed over each " +
  "treatment's service life within the analysis horizon. It counts crashes, not people: a crash that kills or injures several people counts once.";

/** What `ksiAvoidedPerYear` means. */
export const KSI_AVOIDED_PER_YEAR_DEFINITION = "K+A crashes avoided in the first year, when every treatment of the list is in service";

/** What `costPerKsi` means. */
export const COST_PER_KSI_DEFINITION = "lifecycle cost PV per K+A crash avoided (lifecycle cost PV ÷ K+A crashes avoided)";
