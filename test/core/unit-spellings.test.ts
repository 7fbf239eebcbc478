import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { acceptedSpellings, normaliseUnit, type UnitKind } from "../../core/unit-spellings.js";
import { DENSITY_UNITS, DEPTH_UNITS, SLOWNESS_UNITS, VELOCITY_UNITS } from "../../core/units.js";

const KINDS: UnitKind[] = ["velocity", "slowness", "density", "depth"];

describe("normaliseUnit", () => {
  it("reads the spellings met in LAS and CSV files (common practice)", () => {
    const cases: [string, UnitKind, string][] = [
      ["US/F", "slowness", "us/ft"],
      ["us/ft", "slowness", "us/ft"],
      ["uS/ft", "slowness", "us/ft"],
      ["USEC/FT", "slowness", "us/ft"],
      ["US/FT", "slowness", "us/ft"],
      ["µs/ft", "slowness", "us/ft"],
      ["μs/ft", "slowness", "us/ft"],
      ["us/m", "slowness", "us/m"],
      ["US/M", "slowness", "us/m"],
      ["G/C3", "density", "g/cm3"],
      ["g/cm3", "density", "g/cm3"],
      ["G/CC", "density", "g/cm3"],
      ["gm/cc", "density", "g/cm3"],
      ["g/cc", "density", "g/cm3"],
      ["K/M3", "density", "kg/m3"],
      ["kg/m3", "density", "kg/m3"],
      ["KG/M3", "density", "kg/m3"],
      ["M/S", "velocity", "m/s"],
      ["m/s", "velocity", "m/s"],
      ["KM/S", "velocity", "km/s"],
      ["FT/S", "velocity", "ft/s"],
      ["F/S", "velocity", "ft/s"],
      ["ft/s", "velocity", "ft/s"],
      ["M", "depth", "m"],
      ["m", "depth", "m"],
      ["F", "depth", "ft"],
      ["FT", "depth", "ft"],
      ["ft", "depth", "ft"],
    ];
    for (const [spelling, kind, unit] of cases) expect(normaliseUnit(spelling), spelling).toEqual({ kind, unit });
  });

  it("ignores surrounding and inner spaces", () => {
    expect(normaliseUnit("  us / ft ")).toEqual({ kind: "slowness", unit: "us/ft" });
  });

  it("returns undefined for units it does not know, and for other quantities", () => {
    for (const spelling of ["", "gAPI", "v/v", "b/e", "s", "ms", "in", "furlong/fortnight"]) {
      expect(normaliseUnit(spelling), spelling).toBeUndefined();
    }
  });

  it("gives only unit ids of core/units for every accepted spelling, whatever its case", () => {
    const tables: Record<UnitKind, object> = {
      velocity: VELOCITY_UNITS,
      slowness: SLOWNESS_UNITS,
      density: DENSITY_UNITS,
      depth: DEPTH_UNITS,
    };
    for (const kind of KINDS) {
      fc.assert(
        fc.property(fc.constantFrom(...acceptedSpellings(kind)), fc.array(fc.boolean(), { minLength: 12, maxLength: 12 }), (spelling, upper) => {
          const recased = [...spelling].map((c, i) => (upper[i] ? c.toUpperCase() : c.toLowerCase())).join("");
          const unit = normaliseUnit(recased);
          expect(unit?.kind).toBe(kind);
          expect(Object.keys(tables[kind])).toContain(unit?.unit);
        }),
      );
    }
  });
});

describe("acceptedSpellings", () => {
  it("lists each kind's spellings, none shared between kinds", () => {
    const lists = KINDS.map(acceptedSpellings);
    for (const list of lists) expect(list.length).toBeGreaterThan(1);
    const all = lists.flat().map((s) => s.toLowerCase());
    expect(new Set(all).size).toBe(all.length);
    expect(acceptedSpellings("slowness")).toContain("us/ft");
  });
});
