import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findCorrelation } from "../../../core/correlations/catalogue.js";
import type { Correlation } from "../../../core/correlations/correlation.js";

/** Pascals in one Mpsi (NIST SP 811, B.8: 1 psi = 6 894.757 293 168 Pa). */
const PA_PER_MPSI = 6894.757293168362e6;
const GPA_PER_MPSI = PA_PER_MPSI / 1e9;

const entry = (id: string): Correlation => {
  const correlation = findCorrelation(id);
  if (correlation === undefined) throw new Error(`${id} is not in the catalogue`);
  return correlation;
};
const edMpsi = (...mpsi: number[]) => ({ dynamicYoungsModulusPascals: Float64Array.from(mpsi, (m) => m * PA_PER_MPSI) });
const edGpa = (...gpa: number[]) => ({ dynamicYoungsModulusPascals: Float64Array.from(gpa, (g) => g * 1e9) });

describe("static_e.lacy1997*", () => {
  it("all lithologies: Es = 0.018·Ed² + 0.422·Ed in Mpsi, reported in GPa (Lacy 1997, SPE 38716, as reproduced by Zhang 2019)", () => {
    const { values } = entry("static_e.lacy1997").evaluate(edMpsi(3, 5));
    // 0.018·3² + 0.422·3 = 0.162 + 1.266 = 1.428 Mpsi
    expect(values[0]).toBeCloseTo(1.428 * GPA_PER_MPSI, 9);
    // 0.018·5² + 0.422·5 = 0.45 + 2.11 = 2.56 Mpsi
    expect(values[1]).toBeCloseTo(2.56 * GPA_PER_MPSI, 9);
  });

  it("sandstone: Es = 0.0293·Ed² + 0.4533·Ed in Mpsi (Lacy 1997, SPE 38716, as reproduced by Zhang 2019)", () => {
    const { values } = entry("static_e.lacy1997_sandstone").evaluate(edMpsi(3, 5));
    // 0.0293·9 + 0.4533·3 = 0.2637 + 1.3599 = 1.6236 Mpsi
    expect(values[0]).toBeCloseTo(1.6236 * GPA_PER_MPSI, 9);
    // 0.0293·25 + 0.4533·5 = 0.7325 + 2.2665 = 2.999 Mpsi
    expect(values[1]).toBeCloseTo(2.999 * GPA_PER_MPSI, 9);
  });

  it("shale: Es = 0.0428·Ed² + 0.2334·Ed in Mpsi (Lacy 1997, SPE 38716, as reproduced by Zhang 2019)", () => {
    const { values } = entry("static_e.lacy1997_shale").evaluate(edMpsi(2, 4));
    // 0.0428·4 + 0.2334·2 = 0.1712 + 0.4668 = 0.638 Mpsi
    expect(values[0]).toBeCloseTo(0.638 * GPA_PER_MPSI, 9);
    // 0.0428·16 + 0.2334·4 = 0.6848 + 0.9336 = 1.6184 Mpsi
    expect(values[1]).toBeCloseTo(1.6184 * GPA_PER_MPSI, 9);
  });

  it("the same rock given as 30 GPa or as 4.351132 Mpsi gives the same Es, 15.01 GPa, not the 28.86 of plugging GPa into a Mpsi formula (Lacy 1997; NIST SP 811 psi)", () => {
    // 30 GPa / 6.894757293168 GPa per Mpsi = 4.351132 Mpsi
    const asGpa = entry("static_e.lacy1997").evaluate(edGpa(30)).values[0];
    const asMpsi = entry("static_e.lacy1997").evaluate(edMpsi(4.351132131906504)).values[0];
    expect(asMpsi).toBeCloseTo(asGpa, 9);
    // 0.018·4.351132² + 0.422·4.351132 = 0.340782 + 1.836178 = 2.176960 Mpsi = 15.0096 GPa
    expect(asGpa).toBeCloseTo(2.17696 * GPA_PER_MPSI, 4);
    expect(asGpa).toBeCloseTo(15.0096, 3);
    // the unit mistake: 0.018·30² + 0.422·30 = 16.2 + 12.66 = 28.86
    expect(Math.abs(asGpa - 28.86)).toBeGreaterThan(10);
  });

  it("each Lacy fit gives a static modulus below the dynamic one for Ed from 0.1 to 15 Mpsi (common practice: static moduli of rock are below dynamic ones)", () => {
    const ids = ["static_e.lacy1997", "static_e.lacy1997_sandstone", "static_e.lacy1997_shale"];
    fc.assert(
      fc.property(fc.double({ min: 0.1, max: 15, noNaN: true }), fc.constantFrom(...ids), (mpsi, id) => {
        const es = entry(id).evaluate(edMpsi(mpsi)).values[0];
        return es > 0 && es < mpsi * GPA_PER_MPSI;
      }),
    );
  });
});

describe("static_e.ohen2003", () => {
  it("Es = 0.0158·Ed^2.74 in Mpsi (Ohen 2003, SPE 82236, as reproduced by Zhang 2019)", () => {
    const { values } = entry("static_e.ohen2003").evaluate(edMpsi(2, 4));
    // 2^2.74 = 6.68070; 0.0158·6.68070 = 0.105555 Mpsi
    expect(values[0]).toBeCloseTo(0.105555 * GPA_PER_MPSI, 5);
    // 4^2.74 = 44.6318; 0.0158·44.6318 = 0.705182 Mpsi
    expect(values[1]).toBeCloseTo(0.705182 * GPA_PER_MPSI, 5);
  });
});

describe("static_e.eissa1988*", () => {
  it("linear form Es = 0.74·Ed − 0.82 in GPa (Eissa & Kazi 1988, from memory)", () => {
    const { values } = entry("static_e.eissa1988").evaluate(edGpa(20, 50));
    // 0.74·20 − 0.82 = 14.8 − 0.82 = 13.98
    expect(values[0]).toBeCloseTo(13.98, 10);
    // 0.74·50 − 0.82 = 37 − 0.82 = 36.18
    expect(values[1]).toBeCloseTo(36.18, 10);
  });

  it("density form log10(Es) = 0.02 + 0.77·log10(ρ·Ed), ρ in g/cm3 and Ed in GPa (Eissa & Kazi 1988, from memory)", () => {
    const inputs = { ...edGpa(20, 40), densityKilogramsPerCubicMetre: Float64Array.of(2500, 2650) };
    const { values } = entry("static_e.eissa1988_density").evaluate(inputs);
    // ρ·Ed = 2.5·20 = 50; log10 50 = 1.698970; 0.02 + 0.77·1.698970 = 1.328207; 10^1.328207 = 21.2915
    expect(values[0]).toBeCloseTo(21.2915, 3);
    // ρ·Ed = 2.65·40 = 106; log10 106 = 2.025306; 0.02 + 0.77·2.025306 = 1.579486; 10^1.579486 = 37.9739
    expect(values[1]).toBeCloseTo(37.9739, 3);
  });

  it("the density form satisfies its published logarithmic identity for random valid inputs (Eissa & Kazi 1988, from memory)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 100, noNaN: true }), fc.double({ min: 1.8, max: 3, noNaN: true }), (gpa, rho) => {
        const inputs = { ...edGpa(gpa), densityKilogramsPerCubicMetre: Float64Array.of(rho * 1000) };
        const es = entry("static_e.eissa1988_density").evaluate(inputs).values[0];
        return Math.abs(Math.log10(es) - (0.02 + 0.77 * Math.log10(rho * gpa))) < 1e-12;
      }),
    );
  });
});

describe("static_e.wang2000*", () => {
  it("hard rock Es = 1.153·Ed − 15.2 in GPa (Wang 2000, from memory)", () => {
    const { values } = entry("static_e.wang2000_hard").evaluate(edGpa(30, 60));
    // 1.153·30 − 15.2 = 34.59 − 15.2 = 19.39
    expect(values[0]).toBeCloseTo(19.39, 10);
    // 1.153·60 − 15.2 = 69.18 − 15.2 = 53.98
    expect(values[1]).toBeCloseTo(53.98, 10);
  });

  it("soft rock Es = 0.4145·Ed − 1.0593 in GPa (Wang 2000, from memory)", () => {
    const { values } = entry("static_e.wang2000_soft").evaluate(edGpa(5, 10));
    // 0.4145·5 − 1.0593 = 2.0725 − 1.0593 = 1.0132
    expect(values[0]).toBeCloseTo(1.0132, 10);
    // 0.4145·10 − 1.0593 = 4.145 − 1.0593 = 3.0857
    expect(values[1]).toBeCloseTo(3.0857, 10);
  });

  it("flags Ed below 15 GPa for hard rock and above 15 GPa for soft rock, neither at 15 GPa (Wang 2000 hard/soft split, from memory)", () => {
    const inputs = edGpa(14.99, 15, 15.01);
    expect([...entry("static_e.wang2000_hard").evaluate(inputs).outsideCalibration]).toEqual([1, 0, 0]);
    expect([...entry("static_e.wang2000_soft").evaluate(inputs).outsideCalibration]).toEqual([0, 0, 1]);
  });
});

describe("static_e.horsrud2001", () => {
  it("E = 0.076·Vp^3.23 with Vp in km/s, from Vp in m/s (Horsrud 2001, SPE Drilling & Completion 16(2), as reproduced by Zhang 2019)", () => {
    const { values } = entry("static_e.horsrud2001").evaluate({ vpMetresPerSecond: Float64Array.of(2000, 3000) });
    // 2^3.23 = 9.38268; 0.076·9.38268 = 0.713084 GPa
    expect(values[0]).toBeCloseTo(0.713084, 5);
    // 3^3.23 = 34.7618; 0.076·34.7618 = 2.641893 GPa
    expect(values[1]).toBeCloseTo(2.641893, 5);
  });

  it("equals the published slowness form 0.076·(304.8/Δt)^3.23 for random Vp (Horsrud 2001, as reproduced by Zhang 2019)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1500, max: 6000, noNaN: true }), (vp) => {
        const dt = 304800 / vp;
        const e = entry("static_e.horsrud2001").evaluate({ vpMetresPerSecond: Float64Array.of(vp) }).values[0];
        return Math.abs(e / (0.076 * (304.8 / dt) ** 3.23) - 1) < 1e-12;
      }),
    );
  });
});
