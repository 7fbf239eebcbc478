import { defineCorrelation } from "./define-correlation.js";
import { CHANG_2006, ZHANG_2019_HANDBOOK } from "./sources.js";

// McNally (1987), Bowen Basin sandstones: UCS = 1200·exp(−0.036·Δt), UCS in MPa, Δt in µs/ft.
export const mcnally1987 = defineCorrelation({
  id: "ucs.mcnally1987",
  kind: "ucs",
  lithology: "sandstone",
  formula: "UCS = 1200·exp(−0.036·Δt) (UCS in MPa, Δt in µs/ft)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Δt", unit: "us/ft", range: undefined }],
  publishedOutputUnit: "MPa",
  citation: {
    authors: "McNally, G. H.",
    year: 1987,
    title: "Estimation of coal measures rock strength using sonic and neutron logs",
    source: "Geoexploration 24(4–5), 381–395",
  },
  compiledIn: CHANG_2006,
  caveats: `Fine-grained sandstones of the Bowen Basin, Australia, consolidated and unconsolidated. Δt is derived from Vp (Δt = 304800/Vp[m/s]). No Δt range is published in what we checked, so no sample is flagged. Formula checked against ${ZHANG_2019_HANDBOOK}; journal details from memory.`,
  compute: (x) => 1200 * Math.exp(-0.036 * x[0]),
});

// Bradford et al. (1998), sandstones: UCS = 2.28 + 4.1089·E, UCS in MPa, E (static) in GPa.
export const bradford1998 = defineCorrelation({
  id: "ucs.bradford1998",
  kind: "ucs",
  lithology: "sandstone",
  formula: "UCS = 2.28 + 4.1089·E (UCS in MPa, E in GPa)",
  inputs: [{ quantity: "staticYoungsModulusPascals", symbol: "E", unit: "GPa", range: undefined }],
  publishedOutputUnit: "MPa",
  citation: {
    authors: "Bradford, I. D. R.; Fuller, J.; Thompson, P. J.; Walsgrove, T. R.",
    year: 1998,
    title: "Benefits of assessing the solids production risk in a North Sea reservoir using elastoplastic modelling",
    source: "SPE/ISRM Rock Mechanics in Petroleum Engineering (Eurock 98), Trondheim, paper SPE 47360",
  },
  compiledIn: CHANG_2006,
  caveats:
    "Takes the static Young's modulus: the compilation's moduli are laboratory (static) values, and the source fitted strength to static stiffness (from memory, not checked against either text); pass a measured or static_e-predicted modulus, not the dynamic log modulus. No range is published in what we checked, so no sample is flagged. Formula and citation from memory of the compilation; not checked against it or the paper.",
  compute: (x) => 2.28 + 4.1089 * x[0],
});
