import { describe, expect, it } from "vitest";
import { parseCsv, parseLas } from "../../core/index.js";
import { NULL_VALUE, syntheticWell, syntheticWellCsv, syntheticWellLas } from "../../bench/synthetic-well.js";

const text = (chunks: Iterable<string>) => [...chunks].join("");
const same = (read: Float64Array, written: Float64Array) => written.every((value, i) => Object.is(read[i], value));

describe("the benchmark's synthetic well (Marram Bank 7, fictional)", () => {
  it("is the same well for the same seed and another for another seed", () => {
    expect(syntheticWell(500, 3)).toEqual(syntheticWell(500, 3));
    expect(syntheticWell(500, 3).dtcMicrosecondsPerFoot).not.toEqual(syntheticWell(500, 4).dtcMicrosecondsPerFoot);
  });

  it("carries every defect the benchmark relies on: DTS not logged, RHOB at the null value, DTS ≥ DTC·√2 mispicks and DTS < DTC", () => {
    const well = syntheticWell(20_000);
    const count = (test: (i: number) => boolean) => well.depthMetres.filter((_, i) => test(i)).length;
    const dtc = well.dtcMicrosecondsPerFoot;
    const dts = well.dtsMicrosecondsPerFoot;
    expect(count((i) => Number.isNaN(dts[i]))).toBeGreaterThan(20);
    expect(count((i) => well.rhobGramsPerCubicCentimetre[i] === NULL_VALUE)).toBeGreaterThan(10);
    // DTS/DTC = Vp/Vs: below √2 is a negative Poisson's ratio, below 1 is Vs above Vp (Mavko et al., Rock Physics Handbook).
    expect(count((i) => dts[i] / dtc[i] < Math.SQRT2 && dts[i] > dtc[i])).toBeGreaterThan(20);
    expect(count((i) => dts[i] < dtc[i])).toBeGreaterThan(5);
  });

  it("writes CSV (RFC 4180, header NAME[unit]) and LAS 2.0 that core's readers read back to the same numbers", () => {
    const well = syntheticWell(3000, 5);
    const csv = parseCsv(text(syntheticWellCsv(well))).table;
    const las = parseLas(text(syntheticWellLas(well))).table;
    expect(csv.curves.map((curve) => `${curve.mnemonic}[${curve.unit}]`)).toEqual(["DEPT[m]", "DTC[us/ft]", "DTS[us/ft]", "RHOB[g/cm3]"]);
    expect(las.curves.map((curve) => curve.mnemonic)).toEqual(["DEPT", "DTC", "DTS", "RHOB"]);
    const written = [well.depthMetres, well.dtcMicrosecondsPerFoot, well.dtsMicrosecondsPerFoot, well.rhobGramsPerCubicCentimetre];
    written.forEach((column, c) => expect(same(csv.columns[c], column), `CSV column ${c}`).toBe(true));
    const lasDts = las.columns[2].map((value) => (value === NULL_VALUE ? NaN : value));
    expect(same(lasDts, well.dtsMicrosecondsPerFoot)).toBe(true);
    expect(same(las.columns[3], well.rhobGramsPerCubicCentimetre)).toBe(true);
  });
});
