import { defineCorrelation, type ResolvedOptions } from "./define-correlation.js";
import { ISOTROPIC_POISSONS_RATIO, POSITIVE_MODULUS } from "./option-range.js";

// Each pair bounds a span the index divides by: the lower one is declared `below` the upper one.
const OPTIONS = [
  { name: "e_min_mpsi", unit: "Mpsi", defaultValue: 1, accepted: POSITIVE_MODULUS, below: "e_max_mpsi", description: "Static Young's modulus of the most ductile rock (brittleness 0 on the modulus term)." },
  { name: "e_max_mpsi", unit: "Mpsi", defaultValue: 8, accepted: POSITIVE_MODULUS, description: "Static Young's modulus of the most brittle rock (brittleness 100 on the modulus term)." },
  { name: "nu_min", unit: "1", defaultValue: 0.15, accepted: ISOTROPIC_POISSONS_RATIO, below: "nu_max", description: "Poisson's ratio of the most brittle rock (brittleness 100 on the ratio term)." },
  { name: "nu_max", unit: "1", defaultValue: 0.4, accepted: ISOTROPIC_POISSONS_RATIO, description: "Poisson's ratio of the most ductile rock (brittleness 0 on the ratio term)." },
] as const;

const boundsOf = (o: ResolvedOptions) => ({
  eMin: o.e_min_mpsi,
  eMax: o.e_max_mpsi,
  nuMin: o.nu_min,
  nuMax: o.nu_max,
});

// Rickman et al. (2008), SPE 115258: BI = 50·((E − Emin)/(Emax − Emin) + (νmax − ν)/(νmax − νmin)), E in Mpsi, BI in %.
export const rickman2008 = defineCorrelation({
  id: "brittleness.rickman2008",
  kind: "brittleness",
  lithology: "shale",
  formula: "BI = 50·((E − Emin)/(Emax − Emin) + (νmax − ν)/(νmax − νmin)) (BI in %, E in Mpsi; defaults Emin = 1, Emax = 8, νmin = 0.15, νmax = 0.40)",
  inputs: [
    { quantity: "staticYoungsModulusPascals", symbol: "E", unit: "Mpsi", range: { min: 1, max: 8 } },
    { quantity: "poissonsRatio", symbol: "ν", unit: "1", range: { min: 0.15, max: 0.4 } },
  ],
  options: OPTIONS,
  publishedOutputUnit: "%",
  citation: {
    authors: "Rickman, R.; Mullen, M.; Petre, E.; Grieser, B.; Kundert, D.",
    year: 2008,
    title: "A practical use of shale petrophysics for stimulation design optimization: all shale plays are not clones of the Barnett Shale",
    source: "SPE Annual Technical Conference and Exhibition, Denver, paper SPE 115258",
    doi: "10.2118/115258-MS",
  },
  caveats:
    "Average of a Young's-modulus term and a Poisson's-ratio term, each normalised to 0–100 % between bounds set for the Barnett Shale; other plays need their own bounds (options). Takes the static Young's modulus and the log (dynamic) Poisson's ratio, as the source does (from memory). Not clipped: a sample outside the bounds gets a value below 0 or above 100 % and is flagged outside calibration, so the caller sees both the number and the warning. Default bounds from memory; not checked against the paper.",
  compute: (x, o) => {
    const { eMin, eMax, nuMin, nuMax } = boundsOf(o);
    return 50 * ((x[0] - eMin) / (eMax - eMin) + (nuMax - x[1]) / (nuMax - nuMin));
  },
  rangesFor: (o) => {
    const { eMin, eMax, nuMin, nuMax } = boundsOf(o);
    return [
      { min: eMin, max: eMax },
      { min: nuMin, max: nuMax },
    ];
  },
});
