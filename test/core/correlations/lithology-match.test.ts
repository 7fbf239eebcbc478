import { describe, expect, it } from "vitest";
import { CORRELATIONS, filterCorrelations } from "../../../core/correlations/catalogue.js";
import { LITHOLOGIES, type Lithology } from "../../../core/correlations/correlation.js";
import { appliesToLithology, LITHOLOGIES_THAT_APPLY } from "../../../core/correlations/lithology-match.js";

const ids = (lithology: Lithology, kind?: (typeof CORRELATIONS)[number]["kind"]) => filterCorrelations({ kind, lithology }).map((c) => c.id);

describe("which correlations apply to a rock (sandstone and shale are clastic, limestone and dolomite carbonate: common practice)", () => {
  it("lists for a limestone its own UCS correlations and the carbonate ones (Militzer 1973, Golubev 1976), not the dolomite one", () => {
    expect(ids("limestone", "ucs")).toEqual(["ucs.militzer1973", "ucs.golubev1976", "ucs.chang2006_limestone"]);
    expect(ids("dolomite", "ucs")).toEqual(["ucs.militzer1973", "ucs.golubev1976", "ucs.chang2006_dolomite"]);
  });

  it("lists for a sandstone the clastic Vs correlation (Castagna 1985) and the density one fitted to any rock (Gardner 1974)", () => {
    expect(ids("sandstone", "vs")).toEqual(["vs.castagna1985", "vs.greenberg1992_sandstone", "vs.han1986"]);
    expect(ids("sandstone", "density")).toEqual(["density.gardner1974"]);
    expect(ids("sandstone", "static_e")).toEqual([
      "static_e.lacy1997",
      "static_e.lacy1997_sandstone",
      "static_e.eissa1988",
      "static_e.eissa1988_density",
      "static_e.wang2000_hard",
      "static_e.wang2000_soft",
    ]);
  });

  it("lists for a group its own and any rock's, not a member's alone: no limestone-only entry for carbonate", () => {
    expect(ids("carbonate", "ucs")).toEqual(["ucs.militzer1973", "ucs.golubev1976"]);
    expect(ids("clastic", "vs")).toEqual(["vs.castagna1985"]);
    expect(ids("carbonate")).not.toContain("ucs.chang2006_limestone");
    expect(ids("carbonate")).toContain("density.gardner1974");
  });

  it("lists for any only what was fitted to any rock, with the stiffness classes, which split every rock type", () => {
    expect(ids("any", "static_e")).toEqual(["static_e.lacy1997", "static_e.eissa1988", "static_e.eissa1988_density", "static_e.wang2000_hard", "static_e.wang2000_soft"]);
    expect(ids("hard_rock", "static_e")).toEqual(["static_e.lacy1997", "static_e.eissa1988", "static_e.eissa1988_density", "static_e.wang2000_hard"]);
    expect(ids("hard_rock", "vs")).toEqual([]);
  });

  it("always lists a rock's own entries and those fitted to any rock, and every lithology's list stays within the vocabulary", () => {
    for (const rock of LITHOLOGIES) {
      expect(LITHOLOGIES_THAT_APPLY[rock]).toContain(rock);
      expect(LITHOLOGIES_THAT_APPLY[rock]).toContain("any");
      for (const applying of LITHOLOGIES_THAT_APPLY[rock]) expect(LITHOLOGIES).toContain(applying);
      const listed = filterCorrelations({ lithology: rock });
      expect(listed.filter((c) => c.lithology === rock)).toEqual(CORRELATIONS.filter((c) => c.lithology === rock));
      expect(listed.every((c) => appliesToLithology(c.lithology, rock))).toBe(true);
    }
  });

  it("a rock gets everything its group gets (what holds for every carbonate holds for a limestone)", () => {
    for (const [group, members] of [["clastic", ["sandstone", "shale"]], ["carbonate", ["limestone", "dolomite"]]] as const) {
      for (const member of members) for (const id of ids(group)) expect(ids(member)).toContain(id);
    }
  });
});
