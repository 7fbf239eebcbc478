import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { findHeaderItem } from "../../../core/las/las-document.js";
import { parseLas } from "../../../core/las/las-reader.js";

const example = (name: string): string => readFileSync(new URL(`../../../examples/${name}`, import.meta.url), "utf8");

describe("the demo well Kestrel Flats 3 (examples/make-demo-well.ts)", () => {
  const document = parseLas(example("demo-well.las"));
  const [depth, dtc, dts, rhob] = document.table.columns;
  const present = (i: number) => dts[i] !== -999.25 && rhob[i] !== -999.25;

  it("is a LAS 2.0 file our reader takes without a warning: about 3000 samples every 0.1524 m, DEPT DTC DTS RHOB GR", () => {
    expect(document.warnings).toEqual([]);
    expect(document.version).toBe("2.0");
    expect(depth.length).toBe(3000);
    expect(document.well).toMatchObject({ step: 0.1524, indexUnit: "M", nullValue: -999.25, wellName: "KESTREL FLATS 3" });
    expect(document.table.curves.map((curve) => `${curve.mnemonic}.${curve.unit}`)).toEqual(["DEPT.M", "DTC.US/F", "DTS.US/F", "RHOB.G/C3", "GR.GAPI"]);
  });

  it("has -999.25 nulls in DTS and RHOB only", () => {
    const nulls = document.table.columns.map((values) => values.filter((value) => value === -999.25).length);
    expect(nulls[0]).toBe(0);
    expect(nulls[1]).toBe(0);
    expect(nulls[2]).toBeGreaterThan(0);
    expect(nulls[3]).toBeGreaterThan(0);
    expect(nulls[4]).toBe(0);
  });

  it("has a mispicked shear stretch with Vp/Vs < √2 and a few samples with DTS < DTC (Vp/Vs = DTS/DTC for slownesses)", () => {
    const belowSqrt2 = [...depth.keys()].filter((i) => present(i) && dts[i] / dtc[i] < Math.SQRT2);
    expect(belowSqrt2.length).toBeGreaterThanOrEqual(20);
    expect(depth[belowSqrt2.at(-1)!] - depth[belowSqrt2[0]]).toBeLessThan(10);
    expect(belowSqrt2.filter((i) => dts[i] < dtc[i]).length).toBeGreaterThanOrEqual(3);
  });

  it("has a washout: a stretch of low RHOB with high DTC", () => {
    const washed = [...depth.keys()].filter((i) => present(i) && rhob[i] < 2.2);
    expect(washed.length).toBeGreaterThanOrEqual(20);
    expect(washed.reduce((sum, i) => sum + dtc[i], 0) / washed.length).toBeGreaterThan(115);
  });

  it("lists formation tops in ~Parameter that match zones.json, whose zones cover the logged interval end to end", () => {
    const zones = JSON.parse(example("zones.json")) as { name: string; top: number; base: number }[];
    expect(zones[0].top).toBe(depth[0]);
    expect(zones.at(-1)!.base).toBe(depth.at(-1));
    zones.forEach((zone, z) => {
      if (z > 0) expect(zone.top).toBe(zones[z - 1].base);
      expect(Number(findHeaderItem(document, "parameter", `TOP${z + 1}`)?.value)).toBe(zone.top);
    });
  });

  it("has a CSV twin (RFC 4180 with CRLF) holding the same numbers, an empty cell where LAS has the null value", () => {
    const lines = example("demo-well.csv").split("\r\n");
    expect(lines[0]).toBe("DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3],GR[gAPI]");
    expect(lines.at(-1)).toBe("");
    const rows = lines.slice(1, -1);
    expect(rows.length).toBe(depth.length);
    rows.forEach((row, i) => {
      const cells = row.split(",");
      expect(cells.map((cell) => (cell === "" ? -999.25 : Number(cell)))).toEqual(document.table.columns.map((values) => values[i]));
    });
  });
});
