import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { InputIssues } from "../../core/input-issues.js";
import { percentileOfSorted } from "../../core/percentile.js";
import { flagBit, invalidatingMask } from "../../core/qc-flags.js";
import { emptyZoneNotes, summariseZones } from "../../core/zone-statistics.js";

const INVALID = invalidatingMask(false);

describe("percentileOfSorted (Hyndman & Fan 1996, definition 7)", () => {
  it("gives 1.3, 2.5 and 3.7 as p10, p50 and p90 of 1, 2, 3, 4 (computed by hand)", () => {
    const sorted = Float64Array.of(1, 2, 3, 4);
    expect(percentileOfSorted(sorted, 10)).toBeCloseTo(1.3, 12);
    expect(percentileOfSorted(sorted, 50)).toBe(2.5);
    expect(percentileOfSorted(sorted, 90)).toBeCloseTo(3.7, 12);
  });

  it("gives 3.5 as the median of 1, 2, 3, 4, 7, 10 (numpy.percentile documentation example, from memory)", () => {
    expect(percentileOfSorted(Float64Array.of(1, 2, 3, 4, 7, 10), 50)).toBe(3.5);
  });

  it("gives 29 as the 40th percentile of 15, 20, 35, 40, 50 (R quantile type 7, computed by hand)", () => {
    expect(percentileOfSorted(Float64Array.of(15, 20, 35, 40, 50), 40)).toBeCloseTo(29, 12);
  });

  it("puts the i-th smallest of k + 1 values at percentile 100·i/k exactly (Hyndman & Fan 1996, definition 7)", () => {
    const finite = fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }).map((v) => (Object.is(v, -0) ? 0 : v));
    fc.assert(
      fc.property(fc.constantFrom(1, 2, 4, 5, 10, 20, 25, 50), fc.infiniteStream(finite), (k, values) => {
        const sorted = Float64Array.from({ length: k + 1 }, () => values.next().value as number).sort();
        for (let i = 0; i <= k; i++) expect(percentileOfSorted(sorted, (100 * i) / k)).toBe(sorted[i]);
      }),
    );
  });

  it("never decreases as the percent grows (Hyndman & Fan 1996, definition 7)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }), { minLength: 1, maxLength: 40 }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        (values, a, b) => {
          const sorted = Float64Array.from(values).sort();
          const [low, high] = a <= b ? [a, b] : [b, a];
          expect(percentileOfSorted(sorted, low)).toBeLessThanOrEqual(percentileOfSorted(sorted, high));
        },
      ),
    );
  });

  it("gives NaN for no values and the value itself for one", () => {
    expect(percentileOfSorted(new Float64Array(0), 50)).toBeNaN();
    expect(percentileOfSorted(Float64Array.of(7), 90)).toBe(7);
  });
});

describe("summariseZones", () => {
  const depth = Float64Array.from({ length: 11 }, (_, i) => 1000 + i);
  const youngsModulus = Float64Array.of(10, 12, 14, NaN, 18, 20, 21, 22, 23, 24, 30);
  const flags = new Uint32Array(11);
  flags[3] = flagBit("missing");
  flags[7] = flagBit("vp_out_of_range");
  const zones = [
    { name: "Upper Sand", top: 1000, base: 1005 },
    { name: "Lower Shale", top: 1005, base: 1010 },
  ];

  it("counts samples, valid samples and flagged fraction and matches statistics computed by hand (Hyndman & Fan 1996, definition 7)", () => {
    const [upper, lower] = summariseZones(depth, zones, { youngs_modulus: youngsModulus }, flags, INVALID);
    expect(upper).toMatchObject({ name: "Upper Sand", top: 1000, base: 1005, count: 5, valid: 4, flagged_fraction: 0.2 });
    const e = upper.properties.youngs_modulus;
    expect([e.count, e.valid, e.mean, e.min, e.p50, e.max]).toEqual([5, 4, 13.5, 10, 13, 18]);
    expect(e.p10).toBeCloseTo(10.6, 12);
    expect(e.p90).toBeCloseTo(16.8, 12);
    expect(lower).toMatchObject({ count: 6, valid: 6, flagged_fraction: 1 / 6 });
    const f = lower.properties.youngs_modulus;
    expect([f.min, f.p10, f.p50, f.p90, f.max]).toEqual([20, 20.5, 22.5, 27, 30]);
    expect(f.mean).toBeCloseTo(140 / 6, 12);
  });

  it("gives a sample at a shared boundary to the lower zone only, and keeps a base no zone starts at", () => {
    const [upper, lower] = summariseZones(depth, zones, {}, flags, INVALID);
    expect(upper.count + lower.count).toBe(11);
    const [alone] = summariseZones(depth, [{ name: "All", top: 1000, base: 1010 }], {}, flags, INVALID);
    expect(alone.count).toBe(11);
  });

  it("lets zones overlap (a base no zone starts at is kept) and leaves samples outside every zone and NaN depths out", () => {
    const withGap = Float64Array.of(990, 1000, NaN, 1002, 1003, 1020);
    const [a, b] = summariseZones(
      withGap,
      [
        { name: "A", top: 1000, base: 1003 },
        { name: "B", top: 1002, base: 1004 },
      ],
      {},
      new Uint32Array(6),
      INVALID,
    );
    expect([a.count, b.count]).toEqual([3, 2]);
  });

  it("reports null statistics, not zeros, for a zone with no sample or no finite value", () => {
    const [empty, allNaN] = summariseZones(
      depth,
      [
        { name: "Below TD", top: 2000, base: 2100 },
        { name: "Gap", top: 1003, base: 1003.5 },
      ],
      { youngs_modulus: youngsModulus },
      flags,
      INVALID,
    );
    expect(empty).toMatchObject({ count: 0, valid: 0, flagged_fraction: null });
    expect(empty.properties.youngs_modulus).toEqual({
      count: 0,
      valid: 0,
      mean: null,
      min: null,
      p10: null,
      p50: null,
      p90: null,
      max: null,
    });
    expect(allNaN.properties.youngs_modulus).toMatchObject({ count: 1, valid: 0, mean: null, p50: null });
  });

  it("leaves invalid samples out of every statistic, inputs echoed beside the properties included (a mispicked Vs ≥ Vp counts nowhere)", () => {
    // Row 1 is a mispicked shear arrival: Vs above Vp, flagged vs_not_below_vp (invalid); its Vs echo stays finite.
    const vs = Float64Array.of(2000, 4000, 2100, 2200);
    const mask = Uint32Array.of(0, flagBit("vs_not_below_vp"), 0, flagBit("vp_vs_high"));
    const [zone] = summariseZones(Float64Array.of(1, 2, 3, 4), [{ name: "Z", top: 0, base: 5 }], { vs }, mask, INVALID);
    expect(zone).toMatchObject({ count: 4, valid: 3, flagged_fraction: 0.5 });
    // A suspect flag (vp_vs_high) keeps its sample in the statistics.
    expect(zone.properties.vs).toMatchObject({ count: 4, valid: 3, min: 2000, p50: 2100, max: 2200 });
    expect(zone.properties.vs.mean).toBeCloseTo(2100, 12);
  });

  it("ignores infinite values as it ignores NaN", () => {
    const [zone] = summariseZones(
      Float64Array.of(1, 2, 3),
      [{ name: "Z", top: 0, base: 5 }],
      { x: Float64Array.of(1, Infinity, 3) },
      new Uint32Array(3),
      INVALID,
    );
    expect(zone.properties.x).toMatchObject({ valid: 2, mean: 2, max: 3 });
  });

  it("gives the same result whatever the order of the samples, so depth may decrease down the file", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.integer({ min: 990, max: 1015 }),
            fc.option(fc.double({ min: -100, max: 100, noNaN: true }), { nil: NaN }),
            fc.nat(3),
          ),
          { minLength: 1, maxLength: 60 },
        ),
        fc.infiniteStream(fc.nat()),
        (samples, keys) => {
          const shuffled = samples
            .map((sample) => ({ sample, key: keys.next().value as number }))
            .sort((a, b) => a.key - b.key)
            .map(({ sample }) => sample);
          const summarise = (rows: typeof samples) =>
            summariseZones(
              Float64Array.from(rows, ([d]) => d),
              zones,
              { x: Float64Array.from(rows, ([, x]) => x) },
              Uint32Array.from(rows, ([, , f]) => f),
              1,
            );
          const a = summarise(samples);
          const b = summarise(shuffled);
          for (let z = 0; z < zones.length; z++) {
            const { properties: pa, ...restA } = a[z];
            const { properties: pb, ...restB } = b[z];
            expect(restB).toEqual(restA);
            const { mean: meanA, ...statsA } = pa.x;
            const { mean: meanB, ...statsB } = pb.x;
            expect(statsB).toEqual(statsA);
            if (meanA === null) expect(meanB).toBeNull();
            else expect(meanB).toBeCloseTo(meanA, 9);
            if (statsA.min !== null) {
              expect(statsA.min).toBeLessThanOrEqual(statsA.p10 as number);
              expect(statsA.p10).toBeLessThanOrEqual(statsA.p50 as number);
              expect(statsA.p50).toBeLessThanOrEqual(statsA.p90 as number);
              expect(statsA.p90).toBeLessThanOrEqual(statsA.max as number);
            }
          }
        },
      ),
    );
  });

  it("refuses a zone whose base is not below its top, or whose bounds are not finite", () => {
    const error = (() => {
      try {
        const bad = [
          { name: "ok", top: 1, base: 2 },
          { name: "upside down", top: 1005, base: 1000 },
          { name: "open", top: NaN, base: Infinity },
        ];
        summariseZones(depth, bad, {}, flags, INVALID);
      } catch (caught) {
        return caught;
      }
    })();
    expect(error).toBeInstanceOf(InputIssues);
    const fields = (error as InputIssues).issues.map((issue) => issue.field);
    expect(fields).toEqual(["zones[1].base", "zones[2].top", "zones[2].base"]);
  });

  it("refuses columns of a length unlike the depth column", () => {
    expect(() => summariseZones(depth, zones, { x: new Float64Array(3) }, flags, INVALID)).toThrow(/properties\.x/);
  });
});

describe("emptyZoneNotes", () => {
  // A fictional well logged from 1450 m to 1907 m, every 0.5 m.
  const logged = Float64Array.from({ length: 915 }, (_, i) => 1450 + i * 0.5);
  const notesFor = (depths: Float64Array, zones: { name: string; top: number; base: number }[], unit: "m" | "ft" = "m") =>
    emptyZoneNotes(depths, summariseZones(depths, zones, {}, new Uint32Array(depths.length), INVALID), unit);

  it("names a zone below the log, its top and base and the log's first and last depth, and the reading in feet (1 ft = 0.3048 m exactly, international foot)", () => {
    const [note, ...rest] = notesFor(logged, [{ name: "A", top: 5000, base: 6000 }]);
    expect(rest).toEqual([]);
    expect(note).toContain('zone "A" (top 5000 m, base 6000 m) holds no sample');
    expect(note).toContain("entirely below the log, whose depths");
    expect(note).toContain("from 1450 m (first) to 1907 m (last)");
    expect(note).toMatch(/check the depth unit of the zones/i);
    expect(note).toContain("read in ft, the zone would run from 1524 m to 1828.8 m, which overlaps the log");
  });

  it("names a zone above the log, without the feet reading when that would not reach the log either", () => {
    const [note] = notesFor(logged, [{ name: "Shallow", top: 100, base: 200 }]);
    expect(note).toContain("entirely above the log");
    expect(note).not.toContain("read in ft");
  });

  it("gives the first and last depth in row order for a log recorded upwards", () => {
    const [note] = notesFor(logged.slice().reverse(), [{ name: "A", top: 5000, base: 6000 }]);
    expect(note).toContain("from 1907 m (first) to 1450 m (last)");
  });

  it("suggests metres for zones in metres on a log in feet", () => {
    const feet = logged.map((d) => d / 0.3048);
    const [note] = notesFor(feet, [{ name: "B", top: 1500, base: 1600 }], "ft");
    expect(note).toContain("entirely above the log");
    expect(note).toContain("read in m");
  });

  it("names a zone within the log's range that holds no sample (between two samples), and passes over zones with samples", () => {
    const notes = notesFor(logged, [
      { name: "Held", top: 1500, base: 1600 },
      { name: "Thin", top: 1500.1, base: 1500.3 },
    ]);
    expect(notes).toHaveLength(1);
    expect(notes[0]).toContain('zone "Thin" (top 1500.1 m, base 1500.3 m) holds no sample');
    expect(notes[0]).toContain("reaches into the log");
    expect(notes[0]).toContain("from 1450 m (first) to 1907 m (last)");
  });

  it("says so when the log has no depth at all, and leaves absent depths out of the first and last", () => {
    expect(notesFor(Float64Array.of(NaN, NaN), [{ name: "A", top: 1, base: 2 }])).toEqual(['zone "A" (top 1 m, base 2 m) holds no sample: the log has no depth value']);
    const [note] = notesFor(Float64Array.of(NaN, 1450, 1451, NaN), [{ name: "A", top: 5000, base: 6000 }]);
    expect(note).toContain("from 1450 m (first) to 1451 m (last)");
  });

  it("is empty when every zone holds a sample", () => {
    expect(notesFor(logged, [{ name: "All", top: 1450, base: 1907 }])).toEqual([]);
  });
});
