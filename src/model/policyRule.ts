/**
 * A policy rule of the scenario. Spending, KSI-share and count rules cover one district, one tag,
 * or (neither) all sites; spending rules give an absolute amount or a share of total spend.
 */
export type PolicyRule =
  | { readonly kind: "must-fund"; readonly site: string; readonly treatments: readonly string[] }
  | { readonly kind: "never-fund"; readonly site: string; readonly treatments: readonly string[] }
  | {
      readonly kind: "spend-cap" | "spend-floor";
      readonly district?: string;
      readonly tag?: string;
      readonly amount?: number;
      /** In a programme: the rule covers this year's spend only. */
      readonly year?: number;
      readonly share?: number;
    }
  | { readonly kind: "ksi-share-floor"; readonly district?: string; readonly tag?: string; readonly share: number }
  | { readonly kind: "max-projects"; readonly district?: string; readonly tag?: string; readonly count: number };
