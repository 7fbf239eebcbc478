import type { Lithology } from "./correlation.js";
import { defineCorrelation } from "./define-correlation.js";
import { GREENBERG_CASTAGNA_1992 } from "./sources.js";

// Castagna, Batzle & Eastwood (1985), mudrock line: Vp = 1.16·Vs + 1.36, velocities in km/s, solved for Vs.
export const castagna1985 = defineCorrelation({
  id: "vs.castagna1985",
  kind: "vs",
  lithology: "clastic",
  formula: "Vp = 1.16·Vs + 1.36, so Vs = (Vp − 1.36)/1.16 (velocities in km/s)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Vp", unit: "km/s", range: undefined }],
  publishedOutputUnit: "km/s",
  citation: {
    authors: "Castagna, J. P.; Batzle, M. L.; Eastwood, R. L.",
    year: 1985,
    title: "Relationships between compressional-wave and shear-wave velocities in clastic silicate rocks",
    source: "Geophysics 50(4), 571–581",
    doi: "10.1190/1.1441933",
  },
  caveats:
    "The mudrock line of water-saturated clastic silicate rocks (shales and sandstones). In gas-bearing sand Vp drops while Vs barely changes, so the line underestimates Vs there; it does not hold for carbonates. Gives Vs ≤ 0 for Vp ≤ 1.36 km/s. No Vp range is published in what we checked, so no sample is flagged. Formula checked against the SEG Wiki entry for the mudrock line.",
  compute: (x) => (x[0] - 1.36) / 1.16,
});

const signed = (value: number): string => (value < 0 ? ` − ${-value}` : ` + ${value}`);

const greenbergCastagna = (lithology: Lithology, a2: number, a1: number, a0: number) =>
  defineCorrelation({
    id: `vs.greenberg1992_${lithology}`,
    kind: "vs",
    lithology,
    formula: `Vs = ${a2 === 0 ? `${a1}·Vp` : `${a2 < 0 ? "−" : ""}${Math.abs(a2)}·Vp²${signed(a1)}·Vp`}${signed(a0)} (velocities in km/s)`,
    inputs: [{ quantity: "vpMetresPerSecond", symbol: "Vp", unit: "km/s", range: undefined }],
    publishedOutputUnit: "km/s",
    citation: GREENBERG_CASTAGNA_1992,
    caveats: `Regression for brine-saturated pure ${lithology}; the source mixes these lithology regressions for mixed rocks, which this entry does not do. No Vp range is published in what we checked, so no sample is flagged. Coefficients and citation from memory; not checked against the paper.`,
    compute: (x) => (a2 * x[0] + a1) * x[0] + a0,
  });

// Greenberg & Castagna (1992), pure-lithology regressions Vs = a2·Vp² + a1·Vp + a0 (km/s).
export const greenberg1992Sandstone = greenbergCastagna("sandstone", 0, 0.80416, -0.85588);
export const greenberg1992Limestone = greenbergCastagna("limestone", -0.05508, 1.01677, -1.03049);
export const greenberg1992Dolomite = greenbergCastagna("dolomite", 0, 0.58321, -0.07775);
export const greenberg1992Shale = greenbergCastagna("shale", 0, 0.76969, -0.86735);

// Han, Nur & Morgan (1986), water-saturated sandstones: Vs = 0.7936·Vp − 0.7868, velocities in km/s.
export const han1986 = defineCorrelation({
  id: "vs.han1986",
  kind: "vs",
  lithology: "sandstone",
  formula: "Vs = 0.7936·Vp − 0.7868 (velocities in km/s)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Vp", unit: "km/s", range: undefined }],
  publishedOutputUnit: "km/s",
  citation: {
    authors: "Han, D.-H.; Nur, A.; Morgan, D.",
    year: 1986,
    title: "Effects of porosity and clay content on wave velocities in sandstones",
    source: "Geophysics 51(11), 2093–2107",
    doi: "10.1190/1.1442062",
  },
  caveats:
    "Ultrasonic laboratory velocities of water-saturated sandstones with a wide range of porosity and clay content, at high effective pressure. This is the commonly quoted Vs(Vp) form; coefficients, data ranges and DOI from memory, not checked against the paper, so no sample is flagged.",
  compute: (x) => 0.7936 * x[0] - 0.7868,
});
