import {
  requireEqualLengths,
  toFloat64Column,
  withDefaultLimits,
  type DensityUnit,
  type ElasticLogRequest,
  type ImpedanceUnit,
  type ModulusUnit,
  type SlownessUnit,
  type SonicCurve,
  type VelocityUnit,
} from "../core/index.js";
import type { ElasticColumnsBody, ElasticPointQuery } from "./schemas/elastic.js";
import { toPlausibilityLimits } from "./schemas/limits.js";

interface UnitChoice {
  velocity: VelocityUnit;
  slowness: SlownessUnit;
  density: DensityUnit;
  modulus: ModulusUnit;
  impedance: ImpedanceUnit;
}

const sonic = (
  velocity: Float64Array | undefined,
  slowness: Float64Array | undefined,
  units: UnitChoice,
): SonicCurve =>
  velocity !== undefined
    ? { measure: "velocity", unit: units.velocity, values: velocity }
    : { measure: "slowness", unit: units.slowness, values: slowness as Float64Array };

const column = (values: unknown[] | undefined, field: string): Float64Array | undefined =>
  values === undefined ? undefined : toFloat64Column(values, field);

const one = (value: number | undefined): Float64Array | undefined =>
  value === undefined ? undefined : Float64Array.of(value);

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
    compressional: sonic(one(query.vp), one(query.dtc), units),
    shear: sonic(one(query.vs), one(query.dts), units),
    density: { unit: units.density, values: Float64Array.of(query.rho) },
    nullValue: query.null_value,
    keepNegativePoisson: query.keep_negative_poisson,
    limits: withDefaultLimits(toPlausibilityLimits(query)),
    modulusUnit: units.modulus,
    velocityUnit: units.velocity,
    impedanceUnit: units.impedance,
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
  requireEqualLengths(columns);
  return {
    core: {
      compressional: sonic(columns.vp, columns.dtc, body.units),
      shear: sonic(columns.vs, columns.dts, body.units),
      density: { unit: body.units.density, values: columns.rho as Float64Array },
      nullValue: body.null_value,
      keepNegativePoisson: body.keep_negative_poisson,
      limits: withDefaultLimits(toPlausibilityLimits(body.limits)),
      modulusUnit: body.units.modulus,
      velocityUnit: body.units.velocity,
      impedanceUnit: body.units.impedance,
    },
    depth: columns.depth,
    top: columns.top,
    base: columns.base,
  };
};

/** Where an interval sits for zone membership: halfway between its top and base. */
export const intervalMidpoints = (top: Float64Array, base: Float64Array): Float64Array =>
  top.map((value, i) => (value + base[i]) / 2);
