import { defineCorrelation } from "./define-correlation.js";
import { HORSRUD_2001, LACY_1997, ZHANG_2019_HANDBOOK } from "./sources.js";

const NO_RANGE = "No range of the input is published in what we checked, so no sample is flagged.";

// Lacy (1997), SPE 38716, all lithologies: Es = 0.018·Ed² + 0.422·Ed, in Mpsi.
export const lacy1997 = defineCorrelation({
  id: "static_e.lacy1997",
  kind: "static_e",
  lithology: "any",
  formula: "Es = 0.018·Ed² + 0.422·Ed (Es and Ed in Mpsi)",
  inputs: [{ quantity: "dynamicYoungsModulusPascals", symbol: "Ed", unit: "Mpsi", range: undefined }],
  publishedOutputUnit: "Mpsi",
  citation: LACY_1997,
  caveats: `Fitted to laboratory tests on Gulf of Mexico sandstones, shales, limestones and dolomites. ${NO_RANGE} Coefficients checked against ${ZHANG_2019_HANDBOOK}, not against the SPE paper itself.`,
  compute: (x) => 0.018 * x[0] * x[0] + 0.422 * x[0],
});

// Lacy (1997), SPE 38716, sandstones: Es = 0.0293·Ed² + 0.4533·Ed, in Mpsi.
export const lacy1997Sandstone = defineCorrelation({
  id: "static_e.lacy1997_sandstone",
  kind: "static_e",
  lithology: "sandstone",
  formula: "Es = 0.0293·Ed² + 0.4533·Ed (Es and Ed in Mpsi)",
  inputs: [{ quantity: "dynamicYoungsModulusPascals", symbol: "Ed", unit: "Mpsi", range: undefined }],
  publishedOutputUnit: "Mpsi",
  citation: LACY_1997,
  caveats: `Fitted to ultrasonic and static tests on Gulf of Mexico sandstone cores. ${NO_RANGE} Coefficients checked against ${ZHANG_2019_HANDBOOK}, not against the SPE paper itself.`,
  compute: (x) => 0.0293 * x[0] * x[0] + 0.4533 * x[0],
});

// Lacy (1997), SPE 38716, shales: Es = 0.0428·Ed² + 0.2334·Ed, in Mpsi.
export const lacy1997Shale = defineCorrelation({
  id: "static_e.lacy1997_shale",
  kind: "static_e",
  lithology: "shale",
  formula: "Es = 0.0428·Ed² + 0.2334·Ed (Es and Ed in Mpsi)",
  inputs: [{ quantity: "dynamicYoungsModulusPascals", symbol: "Ed", unit: "Mpsi", range: undefined }],
  publishedOutputUnit: "Mpsi",
  citation: LACY_1997,
  caveats: `Fitted to Gulf of Mexico shale cores. ${NO_RANGE} Coefficients checked against ${ZHANG_2019_HANDBOOK}, not against the SPE paper itself.`,
  compute: (x) => 0.0428 * x[0] * x[0] + 0.2334 * x[0],
});

// Ohen (2003), SPE 82236, Gulf of Mexico shales: Es = 0.0158·Ed^2.74, in Mpsi.
export const ohen2003 = defineCorrelation({
  id: "static_e.ohen2003",
  kind: "static_e",
  lithology: "shale",
  formula: "Es = 0.0158·Ed^2.74 (Es and Ed in Mpsi)",
  inputs: [{ quantity: "dynamicYoungsModulusPascals", symbol: "Ed", unit: "Mpsi", range: undefined }],
  publishedOutputUnit: "Mpsi",
  citation: {
    authors: "Ohen, H. A.",
    year: 2003,
    title: "Calibrated wireline mechanical rock properties model for predicting and preventing wellbore collapse and sanding",
    source: "SPE European Formation Damage Conference, The Hague, paper SPE 82236",
    doi: "10.2118/82236-MS",
  },
  caveats: `Fitted to Gulf of Mexico shales. The steep power makes Es exceed Ed above about 10.8 Mpsi (75 GPa), far beyond shale stiffness. ${NO_RANGE} Coefficients checked against ${ZHANG_2019_HANDBOOK}; title and paper number from memory.`,
  compute: (x) => 0.0158 * x[0] ** 2.74,
});

const EISSA_KAZI_1988 = {
  authors: "Eissa, E. A.; Kazi, A.",
  year: 1988,
  title: "Relation between static and dynamic Young's moduli of rocks",
  source: "International Journal of Rock Mechanics and Mining Sciences & Geomechanics Abstracts 25(6), 479–482",
};

// Eissa & Kazi (1988), linear form: Es = 0.74·Ed − 0.82, in GPa.
export const eissa1988 = defineCorrelation({
  id: "static_e.eissa1988",
  kind: "static_e",
  lithology: "any",
  formula: "Es = 0.74·Ed − 0.82 (Es and Ed in GPa)",
  inputs: [{ quantity: "dynamicYoungsModulusPascals", symbol: "Ed", unit: "GPa", range: undefined }],
  publishedOutputUnit: "GPa",
  citation: EISSA_KAZI_1988,
  caveats: `Fitted to published static and dynamic moduli of many rock types, igneous and metamorphic as well as sedimentary. Gives Es ≤ 0 for Ed ≤ 1.11 GPa. ${NO_RANGE} Coefficients and citation from memory; not checked against the paper.`,
  compute: (x) => 0.74 * x[0] - 0.82,
});

// Eissa & Kazi (1988), density form: log10(Es) = 0.02 + 0.77·log10(ρ·Ed), Es and Ed in GPa, ρ in g/cm3.
export const eissa1988Density = defineCorrelation({
  id: "static_e.eissa1988_density",
  kind: "static_e",
  lithology: "any",
  formula: "log10(Es) = 0.02 + 0.77·log10(ρ·Ed) (Es and Ed in GPa, ρ in g/cm3)",
  inputs: [
    { quantity: "dynamicYoungsModulusPascals", symbol: "Ed", unit: "GPa", range: undefined },
    { quantity: "densityKilogramsPerCubicMetre", symbol: "ρ", unit: "g/cm3", range: undefined },
  ],
  publishedOutputUnit: "GPa",
  citation: EISSA_KAZI_1988,
  caveats: `The authors report this form fits better than the linear one on the same data set. ${NO_RANGE} Coefficients and citation from memory; not checked against the paper.`,
  compute: (x) => 10 ** (0.02 + 0.77 * Math.log10(x[1] * x[0])),
});

const WANG_2000 = {
  authors: "Wang, Z.",
  year: 2000,
  title: "Dynamic versus static elastic properties of reservoir rocks",
  source:
    "In Wang, Z. & Nur, A. (eds.), Seismic and Acoustic Velocities in Reservoir Rocks, Vol. 3, SEG Geophysics Reprint Series 19, 531–539",
};
const WANG_SPLIT_GPA = 15;

// Wang (2000), hard rocks: Es = 1.153·Ed − 15.2, in GPa.
export const wang2000Hard = defineCorrelation({
  id: "static_e.wang2000_hard",
  kind: "static_e",
  lithology: "hard_rock",
  formula: "Es = 1.153·Ed − 15.2 (Es and Ed in GPa)",
  inputs: [
    { quantity: "dynamicYoungsModulusPascals", symbol: "Ed", unit: "GPa", range: { min: WANG_SPLIT_GPA, max: Infinity } },
  ],
  publishedOutputUnit: "GPa",
  citation: WANG_2000,
  caveats:
    "Laboratory tests on reservoir rocks. Hard rock is taken as Ed ≥ 15 GPa (the split between the hard- and soft-rock fits, from memory, not checked against the source); below 13.2 GPa the formula gives Es ≤ 0. Coefficients from memory; not checked against the source.",
  compute: (x) => 1.153 * x[0] - 15.2,
});

// Wang (2000), soft rocks: Es = 0.4145·Ed − 1.0593, in GPa.
export const wang2000Soft = defineCorrelation({
  id: "static_e.wang2000_soft",
  kind: "static_e",
  lithology: "soft_rock",
  formula: "Es = 0.4145·Ed − 1.0593 (Es and Ed in GPa)",
  inputs: [{ quantity: "dynamicYoungsModulusPascals", symbol: "Ed", unit: "GPa", range: { min: -Infinity, max: WANG_SPLIT_GPA } }],
  publishedOutputUnit: "GPa",
  citation: WANG_2000,
  caveats:
    "Laboratory tests on reservoir rocks. Soft rock is taken as Ed ≤ 15 GPa (the split between the hard- and soft-rock fits, from memory, not checked against the source); below 2.56 GPa the formula gives Es ≤ 0. Coefficients from memory; not checked against the source.",
  compute: (x) => 0.4145 * x[0] - 1.0593,
});

// Horsrud (2001), North Sea shales: E = 0.076·Vp^3.23, E static in GPa, Vp in km/s.
export const horsrud2001 = defineCorrelation({
  id: "static_e.horsrud2001",
  kind: "static_e",
  lithology: "shale",
  formula: "E = 0.076·Vp^3.23 (E in GPa, Vp in km/s; also written 0.076·(304.8/Δt)^3.23 with Δt in µs/ft)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Vp", unit: "km/s", range: undefined }],
  publishedOutputUnit: "GPa",
  citation: HORSRUD_2001,
  caveats: `Fitted to laboratory tests on North Sea shale cores, mostly high-porosity Tertiary shales; E is the static Young's modulus of those tests (from memory of the paper). Predicts from Vp alone, not from a dynamic modulus. ${NO_RANGE} Formula checked against ${ZHANG_2019_HANDBOOK}.`,
  compute: (x) => 0.076 * x[0] ** 3.23,
});
