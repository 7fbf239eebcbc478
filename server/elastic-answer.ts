import {
  FLAGS,
  flagCodesOf,
  severityOf,
  summariseFlags,
  summariseZones,
  type DerivedColumn,
  type Zone,
  type ElasticLog,
  type ElasticLogRequest,
  type FlagCode,
  type Severity,
  type DensityUnit,
  type DepthUnit,
  type ImpedanceUnit,
  type ModulusUnit,
  type SlownessUnit,
  type VelocityUnit,
} from "../core/index.js";
import { derivedColumnsAnswer, empiricalParts, gapFillAnswer } from "./derived-answer.js";
import { OUTPUT_PROPERTIES, propertyColumns, type PropertyKey } from "./output-properties.js";
import { fromPlausibilityLimits } from "./schemas/limits.js";

const MEANING = new Map(FLAGS.map((flag) => [flag.code, flag.meaning]));

/** JSON has no NaN: a NaN becomes null (JSON.stringify does the same for array elements). */
const nullable = (value: number): number | null => (Number.isNaN(value) ? null : value);


const format = (value: number): string => String(Number(value.toPrecision(6)));

/** Names the values behind a flag of one sample, so a curl user sees why without looking anything up. */
const specifics = (code: FlagCode, log: ElasticLog, request: ElasticLogRequest): string => {
  const unit = request.velocityUnit;
  const limits = request.limits;
  const vp = log.vp[0];
  const vs = log.vs[0];
  const ratio = `Vp/Vs = ${format(vp / vs)}`;
  switch (code) {
    case "vs_not_below_vp":
      return `Here Vs = ${format(vs)} ${unit} and Vp = ${format(vp)} ${unit}.`;
    case "negative_bulk_modulus":
    case "vp_vs_below_sqrt2":
    case "vp_vs_high":
      return `Here ${ratio}${code === "vp_vs_high" ? `, above ${limits.vpVsMax}` : ""}.`;
    case "vp_out_of_range":
      return `Here Vp = ${format(vp)} ${unit}; the range is ${limits.vpMinMetresPerSecond}–${limits.vpMaxMetresPerSecond} m/s.`;
    case "vs_out_of_range":
      return `Here Vs = ${format(vs)} ${unit}; the range is ${limits.vsMinMetresPerSecond}–${limits.vsMaxMetresPerSecond} m/s.`;
    case "density_out_of_range":
      return `Here rho = ${format(log.rho[0])} ${request.density.unit}; the range is ${limits.rhoMinGramsPerCubicCentimetre}–${limits.rhoMaxGramsPerCubicCentimetre} g/cm3.`;
    case "density_impossible":
      return `Here rho = ${format(log.rho[0])} ${request.density.unit}.`;
    default:
      return "";
  }
};

/** Units of inputs and outputs as the request chose them (or their defaults). */
export interface UnitsChosen {
  velocity: VelocityUnit;
  slowness: SlownessUnit;
  density: DensityUnit;
  modulus: ModulusUnit;
  impedance: ImpedanceUnit;
}

const unitsOf = <U extends UnitsChosen>(units: U) => ({ ...units, lambda_rho: `${units.modulus}*g/cm3` });

/** The answer of `GET /v1/elastic`: one sample's properties, flags with explanations, units and limits. */
export const pointAnswer = (log: ElasticLog, request: ElasticLogRequest, units: UnitsChosen) => {
  const mask = log.flags[0];
  return {
    E: nullable(log.youngsModulus[0]),
    nu: nullable(log.poissonsRatio[0]),
    G: nullable(log.shearModulus[0]),
    K: nullable(log.bulkModulus[0]),
    lambda: nullable(log.lameLambda[0]),
    M: nullable(log.pWaveModulus[0]),
    vp_vs: nullable(log.vpVsRatio[0]),
    p_impedance: nullable(log.pImpedance[0]),
    s_impedance: nullable(log.sImpedance[0]),
    lambda_rho: nullable(log.lambdaRho[0]),
    mu_rho: nullable(log.muRho[0]),
    vp: nullable(log.vp[0]),
    vs: nullable(log.vs[0]),
    rho: nullable(log.rho[0]),
    valid: (mask & log.invalidMask) === 0,
    flags: flagCodesOf(mask).map((code) => ({
      code,
      severity: severityOf(code, log.invalidMask),
      message: `${MEANING.get(code)} ${specifics(code, log, request)}`.trim(),
    })),
    units: unitsOf(units),
    limits: fromPlausibilityLimits(request.limits),
  };
};

/** Every flag of every sample as `{index, code, severity}`, in row order. */
const sampleFlags = (log: ElasticLog) => {
  const list: { index: number; code: FlagCode; severity: Severity }[] = [];
  for (let i = 0; i < log.flags.length; i++) {
    if (log.flags[i] === 0) continue;
    for (const code of flagCodesOf(log.flags[i])) list.push({ index: i, code, severity: severityOf(code, log.invalidMask) });
  }
  return list;
};

/**
 * The answer of `POST /v1/elastic`: columns of the input's length (as Float64Arrays, written to JSON by
 * `server/json-answer.ts`, NaN as null), flags, legend, summary, units and limits.
 */
export const columnsAnswer = (
  log: ElasticLog,
  request: ElasticLogRequest,
  units: UnitsChosen & { depth: DepthUnit },
  echo: { depth?: Float64Array; top?: Float64Array; base?: Float64Array },
) => {
  const summary = summariseFlags(log.flags, log.invalidMask);
  const legend = Object.fromEntries(
    (Object.keys(summary.flags) as FlagCode[]).map((code) => [
      code,
      { severity: severityOf(code, log.invalidMask), meaning: MEANING.get(code) as string },
    ]),
  );
  return {
    count: log.length,
    ...(echo.depth && { depth: echo.depth }),
    ...(echo.top && { top: echo.top }),
    ...(echo.base && { base: echo.base }),
    ...(Object.fromEntries(OUTPUT_PROPERTIES.map((property) => [property.key, property.column(log)])) as Record<PropertyKey, Float64Array>),
    flags: sampleFlags(log),
    flag_legend: legend,
    summary,
    units: unitsOf(units),
    limits: fromPlausibilityLimits(request.limits),
  };
};

/**
 * What the column answers of `POST /v1/elastic` and `POST /v1/logs` add after the columns, when asked: zone
 * statistics (over `depth`), how many samples gap filling predicted and with which correlation, and the empirical
 * estimates, with the caution whenever the answer rests on an empirical correlation.
 */
export const answerExtras = (
  log: ElasticLog,
  request: ElasticLogRequest,
  zones: readonly Zone[] | undefined,
  depth: Float64Array | undefined,
  derived: Map<string, DerivedColumn> | undefined,
) => ({
  ...(zones && depth && { zones: summariseZones(depth, zones, propertyColumns(log), log.flags, log.invalidMask) }),
  ...((request.fillShear || request.fillDensity) && { filled: log.filled }),
  ...empiricalParts(gapFillAnswer(request), derived && derivedColumnsAnswer(derived)),
});
