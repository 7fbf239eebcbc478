import {
  absentAsNaN,
  InputIssues,
  MAX_LISTED_ISSUES,
  requireEqualLengths,
  toFloat64Column,
  type DensityUnit,
  type ElasticLogRequest,
  type ImpedanceUnit,
  type ModulusUnit,
  type SlownessUnit,
  type SonicCurve,
  type VelocityUnit,
} from "../core/index.js";
import { gapFills } from "./derived-answer.js";
import type { ElasticColumnsBody, ElasticPointQuery } from "./schemas/elastic.js";
import { limitsFrom, type LimitFields } from "./schemas/limits.js";

interface UnitChoice {
  velocity: VelocityUnit;
  slowness: SlownessUnit;
  density: DensityUnit;
  modulus: ModulusUnit;
  impedance: ImpedanceUnit;
}

/**
 * A sonic curve from whichever of velocity or slowness was given; when neither was (shear predicted
 * by vs_from), a column of NaN of the log's length, so every sample is filled.
 */
const sonic = (velocity: Float64Array | undefined, slowness: Float64Array | undefined, units: UnitChoice, length: number): SonicCurve => {
  if (velocity !== undefined) return { measure: "velocity", unit: units.velocity, values: velocity };
  if (slowness !== undefined) return { measure: "slowness", unit: units.slowness, values: slowness };
  return { measure: "velocity", unit: units.velocity, values: new Float64Array(length).fill(NaN) };
};

const absentIfUndefined = (values: Float64Array | undefined, length: number): Float64Array =>
  values ?? new Float64Array(length).fill(NaN);

const column = (values: unknown[] | Float64Array | undefined, field: string): Float64Array | undefined =>
  values === undefined ? undefined : toFloat64Column(values, field);

const one = (value: number | undefined): Float64Array | undefined =>
  value === undefined ? undefined : Float64Array.of(value);

/** Options every query-string request shares (GET /v1/elastic, POST /v1/logs). */
export interface QueryOptions extends LimitFields {
  null_value?: number;
  keep_negative_poisson: boolean;
  modulus_unit: ModulusUnit;
  velocity_unit: VelocityUnit;
  impedance_unit: ImpedanceUnit;
  vs_from?: string;
  rho_from?: string;
  fill?: "nulls" | "all";
}

/** The computation options of a query-string request, in core's terms. */
export const optionsFromQuery = (query: QueryOptions) => ({
  keepNegativePoisson: query.keep_negative_poisson,
  limits: limitsFrom(query, "query"),
  modulusUnit: query.modulus_unit,
  velocityUnit: query.velocity_unit,
  impedanceUnit: query.impedance_unit,
  ...gapFills(query, "query"),
});

/** The core request for the single sample of `GET /v1/elastic`. */
export const pointRequest = (query: ElasticPointQuery): ElasticLogRequest => {
  const units: UnitChoice = {
    velocity: query.velocity_unit,
    slowness: query.slowness_unit,
    density: query.density_unit,
    modulus: query.modulus_unit,
    impedance: query.impedance_unit,
  };
  return {
    compressional: sonic(one(query.vp), one(query.dtc), units, 1),
    shear: sonic(one(query.vs), one(query.dts), units, 1),
    density: { unit: units.density, values: absentIfUndefined(one(query.rho), 1) },
    nullValue: query.null_value,
    ...optionsFromQuery(query),
  };
};

export interface ColumnsRequest {
  core: ElasticLogRequest;
  depth?: Float64Array;
  top?: Float64Array;
  base?: Float64Array;
}

/**
 * Reads the columns of `POST /v1/elastic` in one pass each (element types are checked here,
 * not by the schema, so a million-sample body is walked once) and checks their lengths agree.
 */
export const columnsRequest = (body: ElasticColumnsBody): ColumnsRequest => {
  const columns = {
    vp: column(body.vp, "vp"),
    dtc: column(body.dtc, "dtc"),
    vs: column(body.vs, "vs"),
    dts: column(body.dts, "dts"),
    rho: column(body.rho, "rho"),
    depth: column(body.depth, "depth"),
    top: column(body.top, "top"),
    base: column(body.base, "base"),
  };
  const length = requireEqualLengths(columns);
  // The null value marks an absent depth as it marks an absent log value (as in a well file): NaN, echoed as null,
  // in no zone.
  columns.depth &&= absentAsNaN(columns.depth, body.null_value);
  columns.top &&= absentAsNaN(columns.top, body.null_value);
  columns.base &&= absentAsNaN(columns.base, body.null_value);
  if (columns.top !== undefined && columns.base !== undefined) requireTopsAboveBases(columns.top, columns.base);
  return {
    core: {
      compressional: sonic(columns.vp, columns.dtc, body.units, length),
      shear: sonic(columns.vs, columns.dts, body.units, length),
      density: { unit: body.units.density, values: absentIfUndefined(columns.rho, length) },
      nullValue: body.null_value,
      keepNegativePoisson: body.keep_negative_poisson,
      limits: limitsFrom(body.limits, "body.limits"),
      modulusUnit: body.units.modulus,
      velocityUnit: body.units.velocity,
      impedanceUnit: body.units.impedance,
      ...gapFills(body, "body"),
    },
    depth: columns.depth,
    top: columns.top,
    base: columns.base,
  };
};

/**
 * Refuses intervals whose top lies below their base (depths increase downwards, so top <= base): a reversed
 * interval is a swapped pair of columns or a typing error, and its midpoint would put it in the wrong zone unnoticed.
 */
const requireTopsAboveBases = (top: Float64Array, base: Float64Array): void => {
  const issues = [];
  for (let i = 0; i < top.length && issues.length < MAX_LISTED_ISSUES; i++) {
    if (top[i] > base[i]) issues.push({ field: "base", index: i, message: `base ${base[i]} is above top ${top[i]}: an interval's top is the shallower depth (top <= base)` });
  }
  if (issues.length > 0) throw new InputIssues(issues);
};

/** Where an interval sits for zone membership: halfway between its top and base. */
export const intervalMidpoints = (top: Float64Array, base: Float64Array): Float64Array =>
  top.map((value, i) => (value + base[i]) / 2);
