/** How one SPF's local calibration factor was set. */
export interface SpfCalibration {
  readonly performanceFunction: string;
  readonly factor: number;
  readonly method: "given" | "estimated";
  /** For an estimate: the sites, observed crashes and SPF-predicted crashes over the window behind it. */
  readonly sites?: number;
  readonly observedCrashes?: number;
  readonly predictedCrashes?: number;
}
