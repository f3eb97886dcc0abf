/**
 * The Okabe–Ito colour-blind-safe palette (Okabe & Ito 2008, "Color Universal Design",
 * https://jfly.uni-koeln.de/color/), hex values as published there.
 */
export const OKABE_ITO = {
  black: "#000000",
  orange: "#E69F00",
  skyBlue: "#56B4E9",
  bluishGreen: "#009E73",
  yellow: "#F0E442",
  blue: "#0072B2",
  vermillion: "#D55E00",
  reddishPurple: "#CC79A7",
} as const;
