import {
  FLAGS,
  flagCodesOf,
  type DerivedColumn,
  lasCurvesOf,
  writeCsv,
  writeLas,
  type LasCurveToWrite,
  type LasItemToWrite,
} from "../core/index.js";
import { CAUTION, citationText } from "./derived-answer.js";
import { OUTPUT_PROPERTIES, QC_CURVE, type OutputUnits } from "./output-properties.js";
import { SERVICE_VERSION } from "./version.js";
import type { WellConversion } from "./well-conversion.js";

const outputUnits = (conversion: WellConversion): OutputUnits => ({
  velocity: conversion.request.velocityUnit,
  modulus: conversion.request.modulusUnit,
  impedance: conversion.request.impedanceUnit,
});

const qcColumn = (conversion: WellConversion): Float64Array => Float64Array.from(conversion.log.flags);

/** Column name of a derived curve: EL_ and the correlation id in capitals, its dot an underscore (EL_UCS_MCNALLY1987). */
export const derivedCurveName = (id: string): string => `EL_${id.replace(".", "_").toUpperCase()}`;

const derivedList = (derived: Map<string, DerivedColumn> | undefined): DerivedColumn[] => [...(derived?.values() ?? [])];

/** The input's columns, then every computed property, each derived estimate and the QC bit mask, one row per input row (RFC 4180). */
export const csvChunks = (conversion: WellConversion, derived: Map<string, DerivedColumn> | undefined): Generator<string> => {
  const { table } = conversion.file;
  const units = outputUnits(conversion);
  const estimates = derivedList(derived);
  return writeCsv({
    curves: [
      ...table.curves.map((curve) => ({ name: curve.mnemonic, unit: curve.unit })),
      ...OUTPUT_PROPERTIES.map((property) => ({ name: property.curve, unit: property.unit(units) })),
      ...estimates.map((column) => ({ name: derivedCurveName(column.correlation.id), unit: column.correlation.outputUnit })),
      { name: QC_CURVE, unit: "" },
    ],
    columns: [
      ...table.columns,
      ...OUTPUT_PROPERTIES.map((property) => property.column(conversion.log)),
      ...estimates.map((column) => column.values),
      qcColumn(conversion),
    ],
  });
};

/** `~Other` lines documenting the QC curve's bits, so the file explains itself once loaded elsewhere. */
const qcLegend = (conversion: WellConversion): string[] => [
  `${QC_CURVE} is a bit mask of QC flags raised by elastilog ${SERVICE_VERSION}; 0 means no flag. Bits (value = 2^bit):`,
  ...FLAGS.map(
    (flag) =>
      `  bit ${flag.bit} (value ${2 ** flag.bit}) ${flag.code}, ${
        (conversion.log.invalidMask & (1 << flag.bit)) !== 0 ? "invalid: moduli written as NULL" : "suspect: values kept"
      }. ${flag.meaning}`,
  ),
  "Dynamic (log-derived) moduli are estimates: calibrate against core tests before engineering use;",
  "engineering decisions rest with licensed professionals under local regulations.",
];

const optionItems = (conversion: WellConversion): LasItemToWrite[] => {
  const { request, curves } = conversion;
  const limits = request.limits;
  const source = (role: "vp" | "vs" | "rho") => {
    const choice = curves[role];
    const fill = role === "vs" ? request.fillShear : role === "rho" ? request.fillDensity : undefined;
    return choice ? `${choice.mnemonic} ${choice.unit}` : `PREDICTED BY ${fill?.correlation.id}`;
  };
  return [
    { mnemonic: "EL_VERSION", value: SERVICE_VERSION, description: "ELASTILOG VERSION" },
    { mnemonic: "EL_VP_FROM", value: source("vp"), description: "CURVE AND UNIT READ AS COMPRESSIONAL" },
    { mnemonic: "EL_VS_FROM", value: source("vs"), description: "CURVE AND UNIT READ AS SHEAR" },
    { mnemonic: "EL_RHO_FROM", value: source("rho"), description: "CURVE AND UNIT READ AS BULK DENSITY" },
    { mnemonic: "EL_NEG_PR", value: request.keepNegativePoisson ? "KEEP" : "INVALID", description: "VP/VS BELOW SQRT2 HANDLING" },
    { mnemonic: "EL_RHO_MIN", unit: "G/C3", value: String(limits.rhoMinGramsPerCubicCentimetre), description: "PLAUSIBLE DENSITY MINIMUM" },
    { mnemonic: "EL_RHO_MAX", unit: "G/C3", value: String(limits.rhoMaxGramsPerCubicCentimetre), description: "PLAUSIBLE DENSITY MAXIMUM" },
    { mnemonic: "EL_VP_MIN", unit: "M/S", value: String(limits.vpMinMetresPerSecond), description: "PLAUSIBLE VP MINIMUM" },
    { mnemonic: "EL_VP_MAX", unit: "M/S", value: String(limits.vpMaxMetresPerSecond), description: "PLAUSIBLE VP MAXIMUM" },
    { mnemonic: "EL_VS_MIN", unit: "M/S", value: String(limits.vsMinMetresPerSecond), description: "PLAUSIBLE VS MINIMUM" },
    { mnemonic: "EL_VS_MAX", unit: "M/S", value: String(limits.vsMaxMetresPerSecond), description: "PLAUSIBLE VS MAXIMUM" },
    { mnemonic: "EL_VPVS_MAX", value: String(limits.vpVsMax), description: "PLAUSIBLE VP/VS MAXIMUM" },
  ];
};

const COMPUTED_FORMAT = { kind: "significant", digits: 8 } as const;

/** The input curves as read (for a CSV input: depth first, as LAS needs its index first). */
const inputCurves = (conversion: WellConversion): LasCurveToWrite[] => {
  const { file } = conversion;
  if (file.format === "las") return lasCurvesOf(file.las);
  const curves = file.table.curves.map((curve, c) => ({
    mnemonic: curve.mnemonic,
    unit: curve.unit,
    description: curve.description,
    values: file.table.columns[c],
  }));
  const depthIndex = conversion.curves.depth?.index;
  if (depthIndex !== undefined) return [curves[depthIndex], ...curves.filter((_, c) => c !== depthIndex)];
  const rows = conversion.log.length;
  return [{ mnemonic: "INDEX", unit: "", description: "SAMPLE NUMBER", values: Float64Array.from({ length: rows }, (_, i) => i) }, ...curves];
};

/**
 * LAS 2.0: the input's header sections and curves kept, the computed curves appended with units and
 * descriptions, the QC bit mask curve documented in ~Other, the options used in ~Parameter, the same NULL.
 */
export const lasChunks = (conversion: WellConversion, derived: Map<string, DerivedColumn> | undefined): Generator<string> => {
  const units = outputUnits(conversion);
  const computed: LasCurveToWrite[] = OUTPUT_PROPERTIES.map((property) => ({
    mnemonic: property.curve,
    unit: property.unit(units),
    description: property.description,
    values: property.column(conversion.log),
    format: COMPUTED_FORMAT,
  }));
  const estimates: LasCurveToWrite[] = derivedList(derived).map(({ correlation, values }) => ({
    mnemonic: derivedCurveName(correlation.id),
    unit: correlation.outputUnit,
    // LAS descriptions end the line and may not hold a colon (CWLS LAS 2.0, the colon delimits them).
    description: `EMPIRICAL ${correlation.kind.toUpperCase()} ${citationText(correlation.citation).replaceAll("doi:", "doi ").replaceAll(":", " -")}`,
    values,
    format: COMPUTED_FORMAT,
  }));
  const caution = estimates.length === 0 ? [] : ["EL_ curves named after a correlation are empirical estimates. " + CAUTION];
  return writeLas({
    header: conversion.file.format === "las" ? conversion.file.las.sections : undefined,
    curves: [
      ...inputCurves(conversion),
      ...computed,
      ...estimates,
      { mnemonic: QC_CURVE, unit: "", description: "QC FLAG BIT MASK (SEE ~OTHER)", values: qcColumn(conversion), format: { kind: "decimals", decimals: 0 } },
    ],
    nullValue: conversion.nullValue,
    parameters: optionItems(conversion),
    otherLines: [...qcLegend(conversion), ...caution],
  });
};

/**
 * One JSON object per sample and line (NDJSON, application/x-ndjson) for line-oriented pipelines: the row
 * index, the depth when there is one, every property (null where invalid), each derived estimate by its id,
 * and the sample's flag codes.
 */
export function* ndjsonChunks(conversion: WellConversion, derived: Map<string, DerivedColumn> | undefined): Generator<string> {
  const { log, depth } = conversion;
  const columns = OUTPUT_PROPERTIES.map((property) => [property.key, property.column(log)] as const);
  const estimates = derivedList(derived).map((column) => [column.correlation.id, column.values] as const);
  const nullable = (value: number) => (Number.isNaN(value) ? null : value);
  let chunk = "";
  for (let i = 0; i < log.length; i++) {
    const row: Record<string, unknown> = { index: i };
    if (depth !== undefined) row.depth = nullable(depth[i]);
    for (const [key, column] of columns) row[key] = nullable(column[i]);
    for (const [id, values] of estimates) row[id] = nullable(values[i]);
    row.flags = flagCodesOf(log.flags[i]);
    chunk += `${JSON.stringify(row)}\n`;
    if (chunk.length >= 64 * 1024) {
      yield chunk;
      chunk = "";
    }
  }
  if (chunk !== "") yield chunk;
}
