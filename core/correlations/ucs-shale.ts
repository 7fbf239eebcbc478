import { defineCorrelation } from "./define-correlation.js";
import { CHANG_2006, HORSRUD_2001, LAL_1999, MAVKO_2009_HANDBOOK, ZHANG_2019_HANDBOOK } from "./sources.js";

// Horsrud (2001), North Sea shales: UCS = 0.77·(304.8/Δt)^2.93, UCS in MPa, Δt in µs/ft.
export const horsrud2001 = defineCorrelation({
  id: "ucs.horsrud2001",
  kind: "ucs",
  lithology: "shale",
  formula: "UCS = 0.77·(304.8/Δt)^2.93 (UCS in MPa, Δt in µs/ft; 304.8/Δt is Vp in km/s)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Δt", unit: "us/ft", range: undefined }],
  publishedOutputUnit: "MPa",
  citation: HORSRUD_2001,
  compiledIn: CHANG_2006,
  caveats: `North Sea shales, mostly high-porosity Tertiary. No Δt range is published in what we checked, so no sample is flagged. Formula checked against ${MAVKO_2009_HANDBOOK} and ${ZHANG_2019_HANDBOOK}.`,
  compute: (x) => 0.77 * (304.8 / x[0]) ** 2.93,
});

// Horsrud (2001), North Sea shales: UCS = 7.97·E^0.91, UCS in MPa, E (static) in GPa.
export const horsrud2001Modulus = defineCorrelation({
  id: "ucs.horsrud2001_modulus",
  kind: "ucs",
  lithology: "shale",
  formula: "UCS = 7.97·E^0.91 (UCS in MPa, E in GPa)",
  inputs: [{ quantity: "staticYoungsModulusPascals", symbol: "E", unit: "GPa", range: undefined }],
  publishedOutputUnit: "MPa",
  citation: HORSRUD_2001,
  compiledIn: CHANG_2006,
  caveats: `Takes the static Young's modulus: the source's moduli come from the same laboratory tests as its strengths (from memory of the paper); pass a measured modulus or static_e.horsrud2001, not the dynamic log modulus. North Sea shales, mostly high-porosity Tertiary. No range is published in what we checked, so no sample is flagged. Formula checked against ${MAVKO_2009_HANDBOOK} (table 7.14.2, eq. 17), which gives 7.22·E^0.712 separately, for strong, compacted shales after Chang et al.; some later texts quote that second form for shales in general, so check which one your field's core tests follow.`,
  compute: (x) => 7.97 * x[0] ** 0.91,
});

// Lal (1999), North Sea shales: UCS = 10·(304.8/Δt − 1), UCS in MPa, Δt in µs/ft.
export const lal1999 = defineCorrelation({
  id: "ucs.lal1999",
  kind: "ucs",
  lithology: "shale",
  formula: "UCS = 10·(304.8/Δt − 1) (UCS in MPa, Δt in µs/ft)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Δt", unit: "us/ft", range: undefined }],
  publishedOutputUnit: "MPa",
  citation: LAL_1999,
  compiledIn: CHANG_2006,
  caveats: `North Sea shales, mostly high-porosity Tertiary. Gives UCS ≤ 0 for Δt ≥ 304.8 µs/ft (Vp ≤ 1 km/s). No Δt range is published in what we checked, so no sample is flagged. Formula checked against ${MAVKO_2009_HANDBOOK}.`,
  compute: (x) => 10 * (304.8 / x[0] - 1),
});
