import { defineCorrelation } from "./define-correlation.js";
import { CHANG_2006, LAL_1999 } from "./sources.js";

// Lal (1999), North Sea shales: φ = asin((Vp − 1)/(Vp + 1)), φ in degrees, Vp in km/s.
export const lal1999 = defineCorrelation({
  id: "friction_angle.lal1999",
  kind: "friction_angle",
  lithology: "shale",
  formula: "φ = asin((Vp − 1)/(Vp + 1)) (φ in degrees, Vp in km/s)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Vp", unit: "km/s", range: undefined }],
  publishedOutputUnit: "deg",
  citation: LAL_1999,
  compiledIn: CHANG_2006,
  caveats:
    "Internal friction angle of North Sea shales, mostly high-porosity Tertiary. Gives φ ≤ 0 for Vp ≤ 1 km/s. No Vp range is published in what we checked, so no sample is flagged. Formula from memory of the compilation; not checked against either text.",
  compute: (x) => (Math.asin((x[0] - 1) / (x[0] + 1)) * 180) / Math.PI,
});
