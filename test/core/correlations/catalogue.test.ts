import { describe, expect, it } from "vitest";
import { CORRELATIONS, filterCorrelations, findCorrelation } from "../../../core/correlations/catalogue.js";
import {
  CORRELATION_KINDS,
  INPUT_QUANTITIES,
  KIND_OUTPUT_UNITS,
  LITHOLOGIES,
  type CorrelationInputs,
  type InputQuantity,
} from "../../../core/correlations/correlation.js";
import { describeCorrelation } from "../../../core/correlations/describe-correlation.js";
import { isInputIssues } from "../../../core/input-issues.js";

const ID_PATTERN = /^(static_e|ucs|friction_angle|vs|density|brittleness)\.[a-z]+[0-9]{4}(_[a-z0-9]+)?$/;

/** A plausible value of each quantity for a brine-saturated sedimentary rock (common practice). */
const TYPICAL: Record<InputQuantity, number> = {
  vpMetresPerSecond: 3500,
  densityKilogramsPerCubicMetre: 2450,
  dynamicYoungsModulusPascals: 25e9,
  staticYoungsModulusPascals: 20e9,
  poissonsRatio: 0.25,
};

const columnsFor = (quantities: readonly InputQuantity[], length: number): CorrelationInputs =>
  Object.fromEntries(quantities.map((q) => [q, new Float64Array(length).fill(TYPICAL[q])]));

const fieldsOfIssues = (action: () => unknown): string[] => {
  try {
    action();
  } catch (error) {
    if (isInputIssues(error)) return error.issues.map((issue) => issue.field);
    throw error;
  }
  return [];
};

describe("the correlation catalogue", () => {
  it("holds every correlation the brief names, at least one per kind", () => {
    for (const kind of CORRELATION_KINDS) expect(filterCorrelations({ kind }).length).toBeGreaterThan(0);
    expect(CORRELATIONS.length).toBeGreaterThanOrEqual(27);
  });

  it("has unique ids of the form <kind>.<firstauthor><year>[_<variant>] whose kind prefix is the entry's kind", () => {
    const ids = CORRELATIONS.map((c) => c.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const c of CORRELATIONS) {
      expect(c.id).toMatch(ID_PATTERN);
      expect(c.id.startsWith(`${c.kind}.`)).toBe(true);
      expect(c.id).toContain(String(c.citation.year));
    }
  });

  it("marks every entry empirical, cites it fully and states caveats", () => {
    for (const c of CORRELATIONS) {
      expect(c.empirical).toBe(true);
      expect(c.citation.authors.length).toBeGreaterThan(0);
      expect(c.citation.title.length).toBeGreaterThan(0);
      expect(c.citation.source.length).toBeGreaterThan(0);
      expect(c.citation.year).toBeGreaterThan(1900);
      expect(c.caveats.length).toBeGreaterThan(20);
      expect(c.formula.length).toBeGreaterThan(0);
    }
  });

  it("names the first author of the citation in the id", () => {
    for (const c of CORRELATIONS) {
      const author = c.id.split(".")[1].replace(/[0-9].*$/, "");
      expect(c.citation.authors.toLowerCase().startsWith(author)).toBe(true);
    }
  });

  it("reports each kind in its one unit, uses known lithologies and input quantities, and declares ordered ranges", () => {
    for (const c of CORRELATIONS) {
      expect(c.outputUnit).toBe(KIND_OUTPUT_UNITS[c.kind]);
      expect(LITHOLOGIES).toContain(c.lithology);
      expect(c.inputs.length).toBeGreaterThan(0);
      for (const input of c.inputs) {
        expect(INPUT_QUANTITIES).toContain(input.quantity);
        if (input.range !== undefined) expect(input.range.min).toBeLessThan(input.range.max);
      }
      if (c.outputRange !== undefined) expect(c.outputRange.min).toBeLessThan(c.outputRange.max);
    }
  });

  it("uses every input quantity of the vocabulary in at least one entry", () => {
    const used = new Set(CORRELATIONS.flatMap((c) => c.inputs.map((input) => input.quantity)));
    expect([...used].sort()).toEqual([...INPUT_QUANTITIES].sort());
  });

  it("finds entries by id and filters by kind and lithology", () => {
    expect(findCorrelation("vs.castagna1985")?.kind).toBe("vs");
    expect(findCorrelation("density.gardner1974")?.lithology).toBe("any");
    expect(findCorrelation("ucs.nobody2020")).toBeUndefined();
    expect(filterCorrelations({ kind: "ucs", lithology: "shale" }).map((c) => c.id)).toEqual([
      "ucs.horsrud2001",
      "ucs.horsrud2001_modulus",
      "ucs.lal1999",
    ]);
    // A group's filter holds the group's entries and those fitted to any rock (and the stiffness classes), no member's alone.
    expect(filterCorrelations({ kind: "ucs", lithology: "carbonate" }).map((c) => c.id)).toEqual(["ucs.militzer1973", "ucs.golubev1976"]);
    expect(filterCorrelations()).toHaveLength(CORRELATIONS.length);
  });
});

describe("evaluate, for every entry", () => {
  it("gives NaN (and no calibration flag) where any input is NaN, and a finite value elsewhere", () => {
    for (const c of CORRELATIONS) {
      c.inputs.forEach((input, k) => {
        const inputs = columnsFor(
          c.inputs.map((i) => i.quantity),
          3,
        );
        (inputs[input.quantity] as Float64Array)[1] = NaN;
        const { values, outsideCalibration } = c.evaluate(inputs);
        expect(Number.isFinite(values[0]), `${c.id} input ${k}`).toBe(true);
        expect(values[1], `${c.id} input ${k}`).toBeNaN();
        expect(outsideCalibration[1]).toBe(0);
        expect(values[2]).toBe(values[0]);
      });
    }
  });

  it("leaves its input columns unchanged and returns columns of the input length", () => {
    for (const c of CORRELATIONS) {
      const inputs = columnsFor(
        c.inputs.map((i) => i.quantity),
        4,
      );
      const before = JSON.stringify(Object.values(inputs).map((column) => [...column]));
      const result = c.evaluate(inputs);
      expect(JSON.stringify(Object.values(inputs).map((column) => [...column]))).toBe(before);
      expect(result.values).toHaveLength(4);
      expect(result.outsideCalibration).toHaveLength(4);
    }
  });

  it("handles empty columns", () => {
    for (const c of CORRELATIONS) {
      const result = c.evaluate(columnsFor(c.inputs.map((i) => i.quantity), 0));
      expect(result.values).toHaveLength(0);
    }
  });

  it("names each missing input, and a column whose length differs from the others", () => {
    expect(fieldsOfIssues(() => findCorrelation("static_e.eissa1988_density")!.evaluate({}))).toEqual([
      "dynamicYoungsModulusPascals",
      "densityKilogramsPerCubicMetre",
    ]);
    const mismatched = {
      dynamicYoungsModulusPascals: new Float64Array(3).fill(20e9),
      densityKilogramsPerCubicMetre: new Float64Array(2).fill(2500),
    };
    expect(fieldsOfIssues(() => findCorrelation("static_e.eissa1988_density")!.evaluate(mismatched))).toEqual([
      "densityKilogramsPerCubicMetre",
    ]);
  });

  it("rejects options on an entry that takes none, and ignores options left undefined", () => {
    const gardner = findCorrelation("density.gardner1974")!;
    const inputs = columnsFor(["vpMetresPerSecond"], 1);
    expect(fieldsOfIssues(() => gardner.evaluate(inputs, { exponent: 0.3 }))).toEqual(["exponent"]);
    expect(gardner.evaluate(inputs, { exponent: undefined }).values[0]).toBe(gardner.evaluate(inputs).values[0]);
  });
});

describe("describeCorrelation", () => {
  it("gives plain data that survives a JSON round trip unchanged, with null for absent ranges and open bounds", () => {
    for (const c of CORRELATIONS) {
      const described = describeCorrelation(c);
      expect(JSON.parse(JSON.stringify(described))).toEqual(described);
      expect(Object.values(described).some((value) => typeof value === "function")).toBe(false);
    }
    const hard = describeCorrelation(findCorrelation("static_e.wang2000_hard")!);
    expect(hard.inputs[0].range).toEqual({ min: 15, max: null });
    const mcnally = describeCorrelation(findCorrelation("ucs.mcnally1987")!);
    expect(mcnally.inputs[0]).toEqual({ quantity: "vpMetresPerSecond", symbol: "Δt", unit: "us/ft", range: null });
    expect(mcnally.compiledIn?.authors).toBe("Chang, C.; Zoback, M. D.; Khaksar, A.");
    expect(mcnally.outputRange).toBeNull();
    expect(describeCorrelation(findCorrelation("static_e.lacy1997")!)).toMatchObject({
      publishedOutputUnit: "Mpsi",
      outputUnit: "GPa",
      compiledIn: null,
    });
  });
});
