/**
 * CWLS LAS 2.0 (1992; update of 2017): "LAS consists of files written in ASCII". lasAscii spells the symbols of
 * this service's descriptions in ASCII.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { lasAscii } from "../../../core/las/las-ascii.js";

describe("lasAscii", () => {
  it("spells formulas, citations and ranges in ASCII", () => {
    expect(lasAscii("Vs = (Vp − 1.36)/1.16")).toBe("Vs = (Vp - 1.36)/1.16");
    expect(lasAscii("ρ = 0.31·Vp^0.25")).toBe("rho = 0.31*Vp^0.25");
    expect(lasAscii("Es = 0.018·Ed² + 0.422·Ed")).toBe("Es = 0.018*Ed^2 + 0.422*Ed");
    expect(lasAscii("a friction angle outside 0–90°")).toBe("a friction angle outside 0-90 deg");
    expect(lasAscii("Einige Beiträge der Geophysik zur Primärdatenerfassung")).toBe("Einige Beitrage der Geophysik zur Primardatenerfassung");
    expect(lasAscii("DTC µs/ft")).toBe("DTC us/ft");
  });

  it("gives ASCII for any text, and ASCII text back unchanged", () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary" }), (text) => {
        expect(lasAscii(text)).toMatch(/^[\x00-\x7f]*$/);
      }),
    );
    fc.assert(
      fc.property(fc.string({ unit: "grapheme-ascii" }), (text) => {
        expect(lasAscii(text)).toBe(text);
      }),
    );
  });
});
