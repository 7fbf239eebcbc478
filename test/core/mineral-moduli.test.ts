import { describe, expect, it } from "vitest";
import { velocitiesFromBulkAndShear } from "../../core/index.js";
import { elasticOf, relativeError } from "../helpers/elastic.js";

/**
 * Mineral moduli and densities as tabulated in Mavko, Mukerji & Dvorkin, The Rock Physics Handbook
 * (2nd ed., 2009), its table of moduli and densities of common minerals (compiled there from Carmichael 1989 and others).
 * Values from memory of that table: K and G in GPa, ρ in g/cm3, Vp and Vs in km/s.
 */
const MINERALS = [
  { name: "quartz", k: 36.6, g: 45.0, rho: 2.65, vp: 6.05, vs: 4.09 },
  { name: "calcite", k: 76.8, g: 32.0, rho: 2.71, vp: 6.64, vs: 3.44 },
  { name: "dolomite", k: 94.9, g: 45.0, rho: 2.87, vp: 7.34, vs: 3.96 },
  { name: "halite", k: 24.8, g: 14.9, rho: 2.16, vp: 4.55, vs: 2.63 },
  { name: "anhydrite", k: 56.1, g: 29.1, rho: 2.98, vp: 5.64, vs: 3.13 },
];

describe("mineral table (Rock Physics Handbook, from memory)", () => {
  for (const mineral of MINERALS) {
    it(`${mineral.name}: Vp and Vs from K, G, ρ give K and G back to 1e-12`, () => {
      const { vpMetresPerSecond, vsMetresPerSecond } = velocitiesFromBulkAndShear(mineral.k * 1e9, mineral.g * 1e9, mineral.rho * 1000);
      const log = elasticOf([vpMetresPerSecond], [vsMetresPerSecond], [mineral.rho], {
        limits: { vpMaxMetresPerSecond: 8000 },
      });
      expect(relativeError(log.bulkModulus[0], mineral.k)).toBeLessThan(1e-12);
      expect(relativeError(log.shearModulus[0], mineral.g)).toBeLessThan(1e-12);
      // E = 9KG/(3K + G) (handbook table 2.2.1)
      expect(relativeError(log.youngsModulus[0], (9 * mineral.k * mineral.g) / (3 * mineral.k + mineral.g))).toBeLessThan(1e-12);
      expect(log.flags[0]).toBe(0);
    });

    it(`${mineral.name}: the velocities agree with the table's Vp and Vs within 1% (rounding of the tabulated values)`, () => {
      const { vpMetresPerSecond, vsMetresPerSecond } = velocitiesFromBulkAndShear(mineral.k * 1e9, mineral.g * 1e9, mineral.rho * 1000);
      expect(relativeError(vpMetresPerSecond / 1000, mineral.vp)).toBeLessThan(0.01);
      expect(relativeError(vsMetresPerSecond / 1000, mineral.vs)).toBeLessThan(0.01);
    });
  }
});
