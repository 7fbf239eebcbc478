import { defineCorrelation } from "./define-correlation.js";
import { CHANG_2006, MAVKO_2009_HANDBOOK } from "./sources.js";

const PSI_NOTE =
  "The /145 converts psi to MPa as the compilation writes it (1 MPa = 145.04 psi); we keep the published constant.";

// Militzer & Stoll (1973), carbonates: UCS = (7682/Δt)^1.82 / 145, UCS in MPa, Δt in µs/ft.
export const militzer1973 = defineCorrelation({
  id: "ucs.militzer1973",
  kind: "ucs",
  lithology: "carbonate",
  formula: "UCS = (7682/Δt)^1.82 / 145 (UCS in MPa, Δt in µs/ft)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Δt", unit: "us/ft", range: undefined }],
  publishedOutputUnit: "MPa",
  citation: {
    authors: "Militzer, H.; Stoll, R.",
    year: 1973,
    title: "Einige Beiträge der Geophysik zur Primärdatenerfassung im Bergbau",
    source: "Neue Bergbautechnik 3, 21–25",
  },
  compiledIn: CHANG_2006,
  caveats: `Limestones and dolomites. ${PSI_NOTE} No Δt range is published in what we checked, so no sample is flagged. Formula checked against ${MAVKO_2009_HANDBOOK}; citation details from memory.`,
  compute: (x) => (7682 / x[0]) ** 1.82 / 145,
});

// Golubev & Rabinovich (1976), carbonates: UCS = 10^(2.44 + 109.14/Δt) / 145, UCS in MPa, Δt in µs/ft.
export const golubev1976 = defineCorrelation({
  id: "ucs.golubev1976",
  kind: "ucs",
  lithology: "carbonate",
  formula: "UCS = 10^(2.44 + 109.14/Δt) / 145 (UCS in MPa, Δt in µs/ft)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Δt", unit: "us/ft", range: undefined }],
  publishedOutputUnit: "MPa",
  citation: {
    authors: "Golubev, A. A.; Rabinovich, G. Y.",
    year: 1976,
    title: "Results of applying acoustic logging equipment to determine the strength properties of rocks in solid-mineral deposits (in Russian)",
    source: "Prikladnaya Geofizika 73, 109–116",
  },
  compiledIn: CHANG_2006,
  caveats: `Limestones and dolomites. ${PSI_NOTE} No Δt range is published in what we checked, so no sample is flagged. Formula checked against ${MAVKO_2009_HANDBOOK}; citation details from memory.`,
  compute: (x) => 10 ** (2.44 + 109.14 / x[0]) / 145,
});

const STATIC_MODULUS_NOTE =
  "Takes the static Young's modulus: the compilation fits laboratory (static) moduli (from memory of the paper); pass a measured or static_e-predicted modulus, not the dynamic log modulus.";

// Chang, Zoback & Khaksar (2006), limestones: UCS = 13.8·E^0.51, UCS in MPa, E (static) in GPa.
export const chang2006Limestone = defineCorrelation({
  id: "ucs.chang2006_limestone",
  kind: "ucs",
  lithology: "limestone",
  formula: "UCS = 13.8·E^0.51 (UCS in MPa, E in GPa)",
  inputs: [{ quantity: "staticYoungsModulusPascals", symbol: "E", unit: "GPa", range: undefined }],
  publishedOutputUnit: "MPa",
  outputRange: { min: 10, max: 300 },
  citation: CHANG_2006,
  caveats: `Fitted to limestones with 10 < UCS < 300 MPa; a prediction outside that range is flagged. ${STATIC_MODULUS_NOTE} Formula and range checked against ${MAVKO_2009_HANDBOOK}.`,
  compute: (x) => 13.8 * x[0] ** 0.51,
});

// Chang, Zoback & Khaksar (2006), dolomites: UCS = 25.1·E^0.34, UCS in MPa, E (static) in GPa.
export const chang2006Dolomite = defineCorrelation({
  id: "ucs.chang2006_dolomite",
  kind: "ucs",
  lithology: "dolomite",
  formula: "UCS = 25.1·E^0.34 (UCS in MPa, E in GPa)",
  inputs: [{ quantity: "staticYoungsModulusPascals", symbol: "E", unit: "GPa", range: undefined }],
  publishedOutputUnit: "MPa",
  outputRange: { min: 60, max: 100 },
  citation: CHANG_2006,
  caveats: `Fitted to dolomites with 60 < UCS < 100 MPa; a prediction outside that range is flagged. ${STATIC_MODULUS_NOTE} Formula and range checked against ${MAVKO_2009_HANDBOOK}.`,
  compute: (x) => 25.1 * x[0] ** 0.34,
});
