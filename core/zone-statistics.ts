import { InputIssues, type InputIssue } from "./input-issues.js";
import { requireEqualLengths } from "./numeric-column.js";
import { percentileOfSorted } from "./percentile.js";
import { readableNumber } from "./place-notes.js";
import { DEPTH_UNITS, type DepthUnit } from "./units.js";

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

/** The first and last finite depth in row order, and the shallowest and deepest; undefined for a column without one. */
const depthExtent = (depth: Float64Array): { first: number; last: number; min: number; max: number } | undefined => {
  let first = NaN;
  let last = NaN;
  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < depth.length; i++) {
    const d = depth[i];
    if (!Number.isFinite(d)) continue;
    if (Number.isNaN(first)) first = d;
    last = d;
    if (d < min) min = d;
    if (d > max) max = d;
  }
  return Number.isNaN(first) ? undefined : { first, last, min, max };
};

/**
 * Notes for a reader on the zones that hold no sample (`count` 0, as `summariseZones` counts them), which would
 * otherwise show only null statistics: each names the zone, its top and base, and the log's first and last depth
 * (in row order), and asks to check the depth unit of the zones. A zone wholly above or below the log is the usual
 * mistake of tops in feet for a log in metres (or the reverse): where the zone read in the other depth unit would
 * reach into the log, the note says so. A zone within the log's depths that still holds no sample lies between two
 * samples or in a stretch of absent depths. Depths are in `unit`, the log's depth unit, the zones' too.
 */
export const emptyZoneNotes = (depth: Float64Array, zones: readonly (Zone & { count: number })[], unit: DepthUnit): string[] => {
  const empty = zones.filter((zone) => zone.count === 0);
  if (empty.length === 0) return [];
  const extent = depthExtent(depth);
  const at = (value: number) => `${readableNumber(value)} ${unit}`;
  return empty.map(({ name, top, base }) => {
    const zone = `zone ${JSON.stringify(name)} (top ${at(top)}, base ${at(base)}) holds no sample`;
    if (extent === undefined) return `${zone}: the log has no depth value`;
    const log = `the log, whose depths run from ${at(extent.first)} (first) to ${at(extent.last)} (last)`;
    const outside = base <= extent.min ? "above" : top > extent.max ? "below" : undefined;
    if (outside === undefined) {
      return `${zone}: it reaches into ${log}, but no sample lies in it (it falls between two samples, or where depths are absent). Check the zone's top and base, and that they are in the log's depth unit (${unit})`;
    }
    const other = (Object.keys(DEPTH_UNITS) as DepthUnit[]).find((candidate) => candidate !== unit) as DepthUnit;
    const factor = DEPTH_UNITS[other] / DEPTH_UNITS[unit];
    const [otherTop, otherBase] = [top * factor, base * factor];
    const inOther = otherTop <= extent.max && otherBase >= extent.min ? `; read in ${other}, the zone would run from ${at(otherTop)} to ${at(otherBase)}, which overlaps the log` : "";
    return `${zone}: it lies entirely ${outside} ${log}. Check the depth unit of the zones: they are read in the log's depth unit (${unit})${inOther}`;
  });
};
