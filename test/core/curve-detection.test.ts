import { describe, expect, it } from "vitest";
import { detectCurves } from "../../core/curve-detection.js";
import { CURVE_MNEMONICS } from "../../core/curve-mnemonics.js";
import { InputIssues } from "../../core/input-issues.js";
import type { CurveInfo } from "../../core/well-table.js";

const curves = (...specs: string[]): CurveInfo[] =>
  specs.map((spec) => {
    const [mnemonic, unit = ""] = spec.split(" ");
    return { mnemonic, unit, description: "" };
  });

const issuesOf = (detect: () => unknown): InputIssues => {
  try {
    detect();
  } catch (error) {
    if (error instanceof InputIssues) return error;
    throw error;
  }
  throw new Error("expected InputIssues");
};

describe("detectCurves by mnemonic and unit (common practice)", () => {
  it("finds DTC, DTS, RHOB and DEPT in a typical LAS curve list and reads their units", () => {
    const mapping = detectCurves(curves("DEPT M", "GR GAPI", "DTC US/F", "DTS US/F", "RHOB G/C3", "NPHI V/V"));
    expect(mapping.vp).toMatchObject({ mnemonic: "DTC", index: 2, measure: "slowness", unit: "us/ft", unitAsWritten: "US/F" });
    expect(mapping.vs).toMatchObject({ mnemonic: "DTS", index: 3, measure: "slowness", unit: "us/ft" });
    expect(mapping.rho).toMatchObject({ mnemonic: "RHOB", index: 4, measure: "density", unit: "g/cm3" });
    expect(mapping.depth).toMatchObject({ mnemonic: "DEPT", index: 0, measure: "depth", unit: "m" });
    expect(mapping.vp.reason).toBe("mnemonic DTC is a common compressional-slowness name; unit US/F read as us/ft");
  });

  it("matches mnemonics in any case and ignores the :2 uniqueness suffix", () => {
    const mapping = detectCurves(curves("depth ft", "dtco:2 us/ft", "dtsm us/ft", "rhoz g/cm3"));
    expect([mapping.vp.mnemonic, mapping.vs?.mnemonic, mapping.rho?.mnemonic, mapping.depth?.mnemonic]).toEqual([
      "dtco:2",
      "dtsm",
      "rhoz",
      "depth",
    ]);
    expect(mapping.depth?.unit).toBe("ft");
  });

  it("reads VP and VS with velocity units as velocities", () => {
    const mapping = detectCurves(curves("MD m", "VP km/s", "VS m/s", "DEN kg/m3"));
    expect(mapping.vp).toMatchObject({ measure: "velocity", unit: "km/s" });
    expect(mapping.vs).toMatchObject({ measure: "velocity", unit: "m/s" });
    expect(mapping.rho?.unit).toBe("kg/m3");
  });

  it("lets the unit decide: a curve named VP in us/ft is a slowness, and the reason says so", () => {
    const mapping = detectCurves(curves("VP us/ft", "DTS us/ft", "RHOB g/cc"));
    expect(mapping.vp).toMatchObject({ measure: "slowness", unit: "us/ft" });
    expect(mapping.vp.reason).toContain("compressional-velocity name");
    expect(mapping.vp.reason).toContain("so the curve is taken as a slowness");
  });

  it("takes the ambiguous DT as the compressional sonic", () => {
    const mapping = detectCurves(curves("DEPT m", "DT us/ft", "DTSM us/ft", "RHOB g/cm3"));
    expect(mapping.vp.mnemonic).toBe("DT");
  });

  it("takes a sonic curve with no unit or an unknown one as its mnemonic says, with unit undefined", () => {
    const mapping = detectCurves(curves("DT", "SVEL furlongs", "RHOB"));
    expect(mapping.vp).toMatchObject({ measure: "slowness", unit: undefined, unitAsWritten: "" });
    expect(mapping.vp.reason).toContain("the file gives no unit, so it is taken as a slowness as its mnemonic says");
    expect(mapping.vs).toMatchObject({ measure: "velocity", unit: undefined, unitAsWritten: "furlongs" });
    expect(mapping.vs?.reason).toContain("unit furlongs is not one we recognise");
    expect(mapping.rho).toMatchObject({ measure: "density", unit: undefined });
  });

  it("prefers the better-known mnemonic when two fit, and says so", () => {
    const mapping = detectCurves(curves("DEPT m", "DT us/ft", "DTC us/ft", "DTS us/ft", "RHOB g/cm3"));
    expect(mapping.vp.mnemonic).toBe("DTC");
    expect(mapping.vp.reason).toContain("DT also fits; DTC preferred as the better-known mnemonic");
  });

  it("prefers the first in the file between repeats of one mnemonic, and says so", () => {
    const mapping = detectCurves(curves("DEPT m", "DT us/ft", "DT:2 us/ft", "DT:3 us/ft", "DTS us/ft", "RHOB g/cm3"));
    expect(mapping.vp.mnemonic).toBe("DT");
    expect(mapping.vp.reason).toContain("DT:2, DT:3 also fit; DT preferred as the first in the file");
  });

  it("passes over a matching mnemonic whose unit measures something else", () => {
    const mapping = detectCurves(curves("DEPT m", "RHOB us/ft", "RHOZ g/cm3", "DTC us/ft", "DTS us/ft"));
    expect(mapping.rho?.mnemonic).toBe("RHOZ");
  });

  it("keeps the mnemonic lists ordered best-known first, with no mnemonic in two roles", () => {
    const all = Object.values(CURVE_MNEMONICS).flat();
    expect(new Set(all).size).toBe(all.length);
    expect(CURVE_MNEMONICS.vp[0]).toBe("DTC");
    expect(CURVE_MNEMONICS.rho[0]).toBe("RHOB");
  });
});

describe("detectCurves depth", () => {
  it("falls back to the first column, saying why", () => {
    const mapping = detectCurves(curves("Z m", "DTC us/ft", "DTS us/ft", "RHOB g/cm3"));
    expect(mapping.depth).toMatchObject({ mnemonic: "Z", index: 0, unit: "m" });
    expect(mapping.depth?.reason).toContain("the first column, Z, is taken as the depth");
  });

  it("leaves depth undefined when the first column is a chosen curve or has a unit of another kind", () => {
    expect(detectCurves(curves("DTC us/ft", "DTS us/ft", "RHOB g/cm3")).depth).toBeUndefined();
    expect(detectCurves(curves("X g/cm3", "DTC us/ft", "DTS us/ft", "RHOB g/cm3")).depth).toBeUndefined();
  });
});

describe("detectCurves overrides", () => {
  it("takes the named curves, without regard to case, before any mnemonic rule", () => {
    const mapping = detectCurves(curves("DEPTH_KB ft", "DTC us/ft", "P_SONIC us/ft", "DTS us/ft", "BULK g/cm3"), {
      vp: "p_sonic",
      rho: "BULK",
      depth: "depth_kb",
    });
    expect(mapping.vp).toMatchObject({ mnemonic: "P_SONIC", index: 2, measure: "slowness" });
    expect(mapping.vp.reason).toBe("named by vp_curve; unit us/ft read as us/ft");
    expect(mapping.rho?.mnemonic).toBe("BULK");
    expect(mapping.depth).toMatchObject({ mnemonic: "DEPTH_KB", unit: "ft" });
  });

  it("prefers an exact match of case over a case-insensitive one", () => {
    const mapping = detectCurves(curves("dtc us/ft", "DTC:2 us/ft", "DTS us/ft", "RHOB g/cm3"), { vp: "DTC:2" });
    expect(mapping.vp.index).toBe(1);
  });

  it("does not give a curve chosen by an override to another role", () => {
    const mapping = detectCurves(curves("DEPT m", "DTS us/ft", "DTSM us/ft", "RHOB g/cm3"), { vp: "DTS" });
    expect(mapping.vs?.mnemonic).toBe("DTSM");
  });

  it("takes an unknown sonic curve with no unit as a slowness, the usual form of a sonic log", () => {
    const mapping = detectCurves(curves("SONIC", "DTS us/ft", "RHOB g/cm3"), { vp: "SONIC" });
    expect(mapping.vp.measure).toBe("slowness");
    expect(mapping.vp.reason).toContain("the usual form of a sonic log");
  });

  it("reports an override naming no curve, listing the curves", () => {
    const error = issuesOf(() => detectCurves(curves("DEPT m", "DTC us/ft", "DTS us/ft", "RHOB g/cm3"), { vs: "SHEAR" }));
    expect(error.issues).toEqual([
      { field: "vs_curve", message: "no curve is named SHEAR; the curves are: DEPT [m], DTC [us/ft], DTS [us/ft], RHOB [g/cm3]" },
    ]);
  });

  it("reports an override naming a curve in a unit of the wrong kind", () => {
    const error = issuesOf(() => detectCurves(curves("DEPT m", "DTC us/ft", "DTS us/ft", "RHOB g/cm3"), { vp: "RHOB" }));
    expect(error.issues[0].field).toBe("vp_curve");
    expect(error.issues[0].message).toContain("its unit g/cm3 is a density unit, not a slowness or velocity unit");
  });
});

describe("detectCurves missing roles", () => {
  it("names each missing role, what was looked for and the curves present", () => {
    const error = issuesOf(() => detectCurves(curves("DEPT m", "GR gAPI", "DT us/ft", "RHOB us/ft")));
    expect(error.issues.map((issue) => issue.field)).toEqual(["vs_curve", "rho_curve"]);
    expect(error.issues[0].message).toContain("no shear sonic curve found");
    expect(error.issues[0].message).toContain("DTS, DTSM");
    expect(error.issues[0].message).toContain("curves present: DEPT [m], GR [gAPI], DT [us/ft], RHOB [us/ft]");
    expect(error.issues[1].message).toContain("passed over RHOB (its unit us/ft is a slowness unit)");
  });

  it("reports every role of an empty curve list", () => {
    const error = issuesOf(() => detectCurves([]));
    expect(error.issues.map((issue) => issue.field)).toEqual(["vp_curve", "vs_curve", "rho_curve"]);
    expect(error.issues[0].message).toContain("the file has no curves");
  });
});

describe("optional roles", () => {
  it("a shear or density role declared optional may stay empty (Vs or ρ to be predicted from Vp); others still must be found", () => {
    const curves = [
      { mnemonic: "DEPT", unit: "M", description: "" },
      { mnemonic: "DTC", unit: "US/F", description: "" },
    ];
    const mapping = detectCurves(curves, {}, ["vs", "rho"]);
    expect(mapping.vp.mnemonic).toBe("DTC");
    expect(mapping.vs).toBeUndefined();
    expect(mapping.rho).toBeUndefined();
    expect(() => detectCurves(curves, {}, ["vs"])).toThrow(/rho_curve/);
  });
});

describe("one curve for one role: a curve named for two of Vp, Vs, density and depth is refused, naming both", () => {
  it("refuses DTC as both Vp and Vs (Vs = Vp in every sample is no shear log)", () => {
    const { issues } = issuesOf(() => detectCurves(curves("DEPT M", "DTC US/F", "DTS US/F", "RHOB G/C3"), { vp: "DTC", vs: "dtc" }));
    expect(issues).toEqual([
      {
        field: "vs_curve",
        message: "curve DTC is named for two roles, the compressional sonic (vp_curve) and the shear sonic (vs_curve); name a different curve for one of them",
      },
    ]);
  });

  it("refuses a curve without a unit named for density and depth", () => {
    const { issues } = issuesOf(() => detectCurves(curves("DEPT M", "DTC US/F", "DTS US/F", "AUX"), { rho: "AUX", depth: "AUX" }));
    expect(issues).toEqual([
      {
        field: "depth_curve",
        message: "curve AUX is named for two roles, the bulk density (rho_curve) and the depth (depth_curve); name a different curve for one of them",
      },
    ]);
  });

  it("a curve named for one role is passed over when the others are detected", () => {
    const mapping = detectCurves(curves("DEPT M", "DTC US/F", "DT US/F", "RHOB G/C3"), { vs: "DTC" });
    expect(mapping.vs?.mnemonic).toBe("DTC");
    expect(mapping.vp.mnemonic).toBe("DT");
    expect(issuesOf(() => detectCurves(curves("DEPT M", "DTC US/F", "RHOB G/C3"), { vs: "DTC" })).issues.map((issue) => issue.field)).toEqual(["vp_curve"]);
  });
});
