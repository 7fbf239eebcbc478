import { defineCorrelation } from "./define-correlation.js";

// Gardner, Gardner & Gregory (1974): ρ = 0.31·Vp^0.25, ρ in g/cm3, Vp in m/s (0.23·Vp^0.25 with Vp in ft/s).
export const gardner1974 = defineCorrelation({
  id: "density.gardner1974",
  kind: "density",
  lithology: "any",
  formula: "ρ = 0.31·Vp^0.25 (ρ in g/cm3, Vp in m/s; published as 0.23·Vp^0.25 with Vp in ft/s)",
  inputs: [{ quantity: "vpMetresPerSecond", symbol: "Vp", unit: "m/s", range: { min: 1500, max: 6100 } }],
  publishedOutputUnit: "g/cm3",
  citation: {
    authors: "Gardner, G. H. F.; Gardner, L. W.; Gregory, A. R.",
    year: 1974,
    title: "Formation velocity and density—the diagnostic basics for stratigraphic traps",
    source: "Geophysics 39(6), 770–780",
    doi: "10.1190/1.1440465",
  },
  caveats:
    "An average over brine-saturated sedimentary rocks; it misses evaporites, coal and gas-bearing rock. Calibration range 1.5–6.1 km/s as stated for this relation by Brocher (2005), Bulletin of the Seismological Society of America 95(6), 2081–2092 (from memory and a public summary, not checked against that paper). The ft/s form and the DOI were checked against the SEG Wiki; 0.31 is that constant rounded to m/s.",
  compute: (x) => 0.31 * x[0] ** 0.25,
});
