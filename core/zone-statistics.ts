import { InputIssues, type InputIssue } from "./input-issues.js";
import { requireEqualLengths } from "./numeric-column.js";
import { percentileOfSorted } from "./percentile.js";

export interface Zone {
  name: string;
  /** Shallower bound, in the unit of the depth column. */
  top: number;
  /** Deeper bound, in the unit of the depth column. */
  base: number;
}

/** Statistics of one property over the finite values of a zone's valid samples; null when it has none. */
export interface PropertyStatistics {
  /** Samples in the zone. */
  count: number;
  /** Valid samples in the zone whose value is finite: the values the statistics are over. */
  valid: number;
  mean: number | null;
  min: number | null;
  p10: number | null;
  p50: number | null;
  p90: number | null;
  max: number | null;
}

export interface ZoneSummary {
  name: string;
  top: number;
  base: number;
  /** Samples whose depth lies in the zone. */
  count: number;
  /** Samples in the zone with no invalidating flag. */
  valid: number;
  /** Fraction of the zone's samples carrying any flag; null for a zone with no sample. */
  flagged_fraction: number | null;
  properties: Record<string, PropertyStatistics>;
}

/** Refuses zones without finite limits or with a base not deeper than the top (`InputIssues` naming `zones[i].top|base`). */
export const checkZones = (zones: readonly Zone[]): void => {
  const issues: InputIssue[] = [];
  zones.forEach((zone, i) => {
    if (!Number.isFinite(zone.top)) issues.push({ field: `zones[${i}].top`, message: "must be a finite depth" });
    if (!Number.isFinite(zone.base)) issues.push({ field: `zones[${i}].base`, message: "must be a finite depth" });
    else if (Number.isFinite(zone.top) && zone.base <= zone.top) {
      issues.push({ field: `zones[${i}].base`, message: `must be deeper than the top (${zone.top}), got ${zone.base}` });
    }
  });
  if (issues.length > 0) throw new InputIssues(issues);
};

/** For each zone, whether a depth belongs to it (the rule of `summariseZones`). */
const zoneMembershipTests = (zones: readonly Zone[]): ((depth: number) => boolean)[] => {
  const tops = new Set(zones.map((zone) => zone.top));
  return zones.map(({ top, base }) => {
    const baseIncluded = !tops.has(base);
    return (d: number) => d >= top && (d < base || (d === base && baseIncluded));
  });
};

/** For each zone, 1 for the samples whose depth lies in it (the rule of `summariseZones`), else 0. */
export const zoneMembership = (depth: Float64Array, zones: readonly Zone[]): Uint8Array[] => {
  checkZones(zones);
  return zoneMembershipTests(zones).map((contains) => {
    const members = new Uint8Array(depth.length);
    for (let i = 0; i < depth.length; i++) if (contains(depth[i])) members[i] = 1;
    return members;
  });
};

/** Statistics of a column over a zone's valid samples (`count` is the zone's size); NaN and infinite values are left out. */
const statistics = (column: Float64Array, count: number, validMembers: Uint32Array, scratch: Float64Array): PropertyStatistics => {
  let valid = 0;
  let sum = 0;
  for (let j = 0; j < validMembers.length; j++) {
    const value = column[validMembers[j]];
    if (Number.isFinite(value)) {
      scratch[valid++] = value;
      sum += value;
    }
  }
  if (valid === 0) {
    return { count, valid, mean: null, min: null, p10: null, p50: null, p90: null, max: null };
  }
  const sorted = scratch.subarray(0, valid).sort();
  return {
    count,
    valid,
    mean: sum / valid,
    min: sorted[0],
    p10: percentileOfSorted(sorted, 10),
    p50: percentileOfSorted(sorted, 50),
    p90: percentileOfSorted(sorted, 90),
    max: sorted[valid - 1],
  };
};

/**
 * Per-zone statistics of each property. A zone holds the samples with top ≤ depth < base, and
 * those at depth = base as well unless another zone of the request starts there: contiguous
 * zones share no sample, and a zone alone keeps its base sample. Membership goes by depth value,
 * so the depth column may run in either direction; a NaN depth is in no zone, and zones may overlap.
 * Every statistic is over the zone's valid samples (no flag of `invalidMask`), inputs echoed beside
 * the properties (Vp, Vs, ρ) included, so that a mispicked shear value flagged `vs_not_below_vp` counts
 * in no statistic; NaN and infinite values are left out too. Percentiles interpolate between closest
 * ranks (Hyndman & Fan 1996, definition 7).
 */
export const summariseZones = (
  depth: Float64Array,
  zones: readonly Zone[],
  properties: Readonly<Record<string, Float64Array>>,
  flags: Uint32Array,
  invalidMask: number,
): ZoneSummary[] => {
  const namedProperties = Object.entries(properties);
  requireEqualLengths({
    depth,
    flags,
    ...Object.fromEntries(namedProperties.map(([name, column]) => [`properties.${name}`, column])),
  });
  checkZones(zones);
  const contains = zoneMembershipTests(zones);
  const validBuffer = new Uint32Array(depth.length);
  const scratch = new Float64Array(depth.length);
  return zones.map(({ name, top, base }, z) => {
    let count = 0;
    let valid = 0;
    let flagged = 0;
    for (let i = 0; i < depth.length; i++) {
      if (!contains[z](depth[i])) continue;
      count++;
      const mask = flags[i];
      if (mask !== 0) flagged++;
      if ((mask & invalidMask) === 0) validBuffer[valid++] = i;
    }
    const validMembers = validBuffer.subarray(0, valid);
    const summaries: Record<string, PropertyStatistics> = {};
    for (const [property, column] of namedProperties) summaries[property] = statistics(column, count, validMembers, scratch);
    return { name, top, base, count, valid, flagged_fraction: count === 0 ? null : flagged / count, properties: summaries };
  });
};
