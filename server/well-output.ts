import {
  AsciiText,
  createLasTextWriter,
  csvHeaderRecord,
  writeCsvRecords,
  SHORTEST,
  fullDoublesOf,
  writeColumnValue,
  type NumberFormat,
  FLAGS,
  flagCodesOf,
  invalidatingMask,
  lasAscii,
  lasCurveLayoutOf,
  lasCurveNames,
  lasIndexItems,
  uniqueMnemonics,
  type DerivedColumn,
  type DensityUnit,
  type ElasticLog,
  type LasCurveToWrite,
  type LasItemToWrite,
  type LasTextWriter,
} from "../core/index.js";
import { CAUTION, citationText } from "./derived-answer.js";
import { OUTPUT_PROPERTIES, QC_CURVE, type OutputUnits } from "./output-properties.js";
import { SERVICE_VERSION } from "./version.js";
import type { ConversionPlan } from "./well-conversion.js";
import type { WellHeader } from "./well-upload.js";

/** Consecutive rows of a file and what was computed for them: the unit a streaming conversion writes at a time. */
export interface RowBatch {
  /** Row number (from 0) of the batch's first row in the file. */
  first: number;
  /** The file's columns for these rows, one per curve, as read, except that an absent value (the null value) is NaN. */
  input: readonly Float64Array[];
  log: ElasticLog;
  derived: Map<string, DerivedColumn> | undefined;
  /** The depth curve's values for these rows, when the file has one. */
  depth: Float64Array | undefined;
}

/** Writes a converted well batch by batch into `text`; the first batch's text begins with the header. */
export interface WellOutput {
  /**
   * Present when the header describes every row (LAS out of a CSV file: STRT, STOP and STEP come before the first
   * data line); the caller then tells it, before the first batch, how many rows the file has and how to get an
   * input curve's values over all of them (curve `c` of the file, as `RowBatch.input` orders them).
   */
  wholeFile?(rows: number, curve: (c: number) => Float64Array): void;
  batch(rows: RowBatch, text: AsciiText): void;
}

/** Row numbers `first` … `first + rows − 1`. */
const sampleNumbers = (first: number, rows: number): Float64Array => Float64Array.from({ length: rows }, (_, i) => first + i);

/** Significant digits of computed values in CSV and LAS answers unless `digits=` says otherwise. */
export const DEFAULT_DIGITS = 8;

/** The number format of computed values for `digits=` (1–15, or exact). */
export const computedFormat = (digits: string | undefined): NumberFormat =>
  digits === "exact" ? SHORTEST : { kind: "significant", digits: digits === undefined ? DEFAULT_DIGITS : Number(digits) };

const QC_FORMAT: NumberFormat = { kind: "decimals", decimals: 0 };

export type TextFormat = "csv" | "las" | "ndjson";

const outputUnits = (plan: ConversionPlan): OutputUnits => ({
  velocity: plan.computation.velocityUnit,
  // The density curve's unit, as core keeps it for rho (g/cm3 where every density is predicted by rho_from).
  density: (plan.curves.rho?.unit as DensityUnit | undefined) ?? "g/cm3",
  modulus: plan.computation.modulusUnit,
  impedance: plan.computation.impedanceUnit,
});

const qcColumn = (log: ElasticLog): Float64Array => Float64Array.from(log.flags);

/** Column name of a derived curve: EL_ and the correlation id in capitals, its dot an underscore (EL_UCS_MCNALLY1987). */
export const derivedCurveName = (id: string): string => `EL_${id.replace(".", "_").toUpperCase()}`;

const derivedList = (derived: Map<string, DerivedColumn> | undefined): DerivedColumn[] => [...(derived?.values() ?? [])];

/** Names of the computed columns in output order: the service's own, which an input curve of the same name gives way to. */
const computedNames = (derived: Map<string, DerivedColumn> | undefined): string[] => [
  ...OUTPUT_PROPERTIES.map((property) => property.curve),
  ...derivedList(derived).map((column) => derivedCurveName(column.correlation.id)),
  QC_CURVE,
];

/** The computed columns of a batch in output order: every property, each derived estimate, the QC bit mask. */
const computedColumns = (rows: RowBatch): Float64Array[] => [
  ...OUTPUT_PROPERTIES.map((property) => property.column(rows.log)),
  ...derivedList(rows.derived).map((column) => column.values),
  qcColumn(rows.log),
];

/** The input's columns, then every computed property, each derived estimate and the QC bit mask, one row per input row (RFC 4180). */
const csvOutput = (header: WellHeader, plan: ConversionPlan, computed: NumberFormat): WellOutput => {
  const units = outputUnits(plan);
  let formats: NumberFormat[] | undefined;
  return {
    batch(rows, text) {
      const columns = [...rows.input, ...computedColumns(rows)];
      if (formats === undefined) {
        formats = columns.map((_, c) => (c < rows.input.length ? SHORTEST : c === columns.length - 1 ? QC_FORMAT : computed));
        // An input curve named like a computed one (EL_E) is numbered as a repeated curve is (EL_E:2).
        const names = uniqueMnemonics(
          header.curves.map((curve) => curve.mnemonic),
          { reserved: computedNames(rows.derived) },
        );
        text.utf8(
          csvHeaderRecord([
            ...header.curves.map((curve, c) => ({ name: names[c], unit: curve.unit })),
            ...OUTPUT_PROPERTIES.map((property) => ({ name: property.curve, unit: property.unit(units) })),
            ...derivedList(rows.derived).map((column) => ({ name: derivedCurveName(column.correlation.id), unit: column.correlation.outputUnit })),
            { name: QC_CURVE, unit: "" },
          ]),
        );
      }
      writeCsvRecords(text, columns, formats);
    },
  };
};

/** `~Other` lines documenting the QC curve's bits, so the file explains itself once loaded elsewhere. */
const qcLegend = (invalidMask: number): string[] => [
  `${QC_CURVE} is a bit mask of QC flags raised by elastilog ${SERVICE_VERSION}; 0 means no flag. Bits (value = 2^bit):`,
  ...FLAGS.map(
    (flag) =>
      `  bit ${flag.bit} (value ${2 ** flag.bit}) ${flag.code}, ${
        (invalidMask & (1 << flag.bit)) !== 0 ? "invalid: moduli written as NULL" : "suspect: values kept"
      }. ${flag.meaning}`,
  ),
  "Dynamic (log-derived) moduli are estimates: calibrate against core tests before engineering use;",
  "engineering decisions rest with licensed professionals under local regulations.",
];

/**
 * `~Other` lines with what reading the input noticed before its first sample (an ignored header line, a curve
 * without a unit and the unit taken, the encoding taken), so that a LAS answer carries what a JSON answer's
 * `warnings` do. Notes on the data itself (the index checks) are known only at the end, after ~A has begun.
 */
const readingNotes = (warnings: readonly { line?: number; message: string }[]): string[] =>
  warnings.length === 0
    ? []
    : [
        "Notes from reading the input (line numbers are the input file's):",
        ...warnings.map((warning) => `  ${warning.line === undefined ? "" : `line ${warning.line}: `}${warning.message.replace(/[\r\n]+/g, " ")}`),
      ];

/** Text for a LAS description or ~Other line: no colon, which delimits a LAS line's description (CWLS LAS 2.0). */
const lasSafe = (text: string): string => text.replaceAll("doi:", "doi ").replaceAll(":", " -");

/** The options used, as ~Parameter items; `written` names curve `c` of the file as the answer's ~Curve does. */
const optionItems = (plan: ConversionPlan, written: (c: number) => string): LasItemToWrite[] => {
  const { computation: request, curves } = plan;
  const limits = request.limits;
  const source = (role: "vp" | "vs" | "rho") => {
    const choice = curves[role];
    const fill = role === "vs" ? request.fillShear : role === "rho" ? request.fillDensity : undefined;
    if (choice === undefined) return `PREDICTED BY ${fill?.correlation.id}`;
    const read = `${written(choice.index)} ${choice.unit}`;
    return fill === undefined ? read : `${read}; GAPS PREDICTED BY ${fill.correlation.id}`;
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

type CurveMeta = Omit<LasCurveToWrite, "values">;

/**
 * The input curves as read, and how to pick their columns from a batch: a LAS file's own curves in its order; for a
 * CSV input, depth first (LAS needs its index first) or, without depth, a sample number.
 */
const inputCurves = (
  header: WellHeader,
  plan: ConversionPlan,
): {
  curves: CurveMeta[];
  columns: (input: readonly Float64Array[], first: number) => Float64Array[];
  /** The first (index) curve's values over a whole file of `rows` rows, from the file's curves. */
  index: (rows: number, curve: (c: number) => Float64Array) => Float64Array;
  /** Where curve `c` of the file is in `curves`. */
  position: (c: number) => number;
} => {
  if (header.format === "las") {
    return { curves: lasCurveLayoutOf(header.header), columns: (input) => [...input], index: (_, curve) => curve(0), position: (c) => c };
  }
  const curves = header.curves.map((curve) => ({ mnemonic: curve.mnemonic, unit: curve.unit, description: curve.description }));
  const depthIndex = plan.curves.depth?.index;
  if (depthIndex !== undefined) {
    const order = [depthIndex, ...curves.map((_, c) => c).filter((c) => c !== depthIndex)];
    return {
      curves: order.map((c) => curves[c]),
      columns: (input) => order.map((c) => input[c]),
      index: (_, curve) => curve(depthIndex),
      position: (c) => order.indexOf(c),
    };
  }
  return {
    curves: [{ mnemonic: "INDEX", unit: "", description: "SAMPLE NUMBER" }, ...curves],
    columns: (input, first) => [sampleNumbers(first, input[0]?.length ?? 0), ...input],
    index: (rows) => sampleNumbers(0, rows),
    position: (c) => c + 1,
  };
};

/**
 * LAS 2.0: the input's header sections and curves kept, the computed curves appended with units and
 * descriptions, the QC bit mask curve documented in ~Other, the options used in ~Parameter, the same NULL.
 * A CSV input has no ~Well to keep: its STRT, STOP and STEP come from the whole file's index, given before the
 * first batch (`wholeFile`).
 */
const lasOutput = (header: WellHeader, plan: ConversionPlan, computed: NumberFormat): WellOutput => {
  const units = outputUnits(plan);
  const input = inputCurves(header, plan);
  let writer: LasTextWriter | undefined;
  let wholeFileIndexItems: LasItemToWrite[] | undefined;
  return {
    ...(header.format === "csv" && {
      // STRT, STOP and STEP at once, so that the whole index column is garbage before the first batch is written.
      wholeFile(rows: number, curve: (c: number) => Float64Array) {
        wholeFileIndexItems = lasIndexItems({ ...input.curves[0], values: input.index(rows, curve) }, String(plan.nullValue));
      },
    }),
    batch(rows, text) {
      const columns = [...input.columns(rows.input, rows.first), ...computedColumns(rows)];
      if (writer === undefined) {
        const estimates: CurveMeta[] = derivedList(rows.derived).map(({ correlation }) => ({
          mnemonic: derivedCurveName(correlation.id),
          unit: correlation.outputUnit,
          // LAS descriptions end the line and may not hold a colon (CWLS LAS 2.0, the colon delimits them).
          description: `EMPIRICAL ${correlation.kind.toUpperCase()} ${lasSafe(citationText(correlation.citation))}`,
          format: computed,
        }));
        const outputs: CurveMeta[] = [
          ...OUTPUT_PROPERTIES.map((property) => ({ mnemonic: property.curve, unit: property.unit(units), description: property.description, format: computed })),
          ...estimates,
          { mnemonic: QC_CURVE, unit: "", description: "QC FLAG BIT MASK (SEE ~OTHER)", format: QC_FORMAT },
        ];
        // Input names made valid LAS mnemonics, unique, and never one of the computed curves' (the original kept in the description).
        const inputs = lasCurveNames(input.curves, computedNames(rows.derived));
        // What this service writes is ASCII, as LAS files are (CWLS LAS 2.0); the input's own text is kept as read.
        const curves = [...inputs, ...outputs.map((curve) => ({ ...curve, description: lasAscii(curve.description ?? "") }))];
        const fills = [
          ["Vs", plan.computation.fillShear, "estimated_vs"],
          ["Bulk density", plan.computation.fillDensity, "estimated_rho"],
        ] as const;
        const fillNotes = fills.flatMap(([what, fill, flag]) =>
          fill === undefined ? [] : [`${what} predicted by ${fill.correlation.id} (${fill.correlation.formula}) where flagged ${flag}, an empirical estimate: ${lasSafe(citationText(fill.correlation.citation))}`],
        );
        const caution = estimates.length === 0 && fillNotes.length === 0 ? [] : [...fillNotes, (estimates.length === 0 ? "" : "EL_ curves named after a correlation are empirical estimates. ") + CAUTION];
        writer = createLasTextWriter({
          header: header.format === "las" ? header.header.sections : undefined,
          curves,
          indexItems: header.format === "las" ? undefined : (wholeFileIndexItems ?? lasIndexItems({ ...curves[0], values: columns[0] }, String(plan.nullValue))),
          nullValue: plan.nullValue,
          parameters: optionItems(plan, (c) => inputs[input.position(c)].mnemonic).map((item) => ({ ...item, value: lasAscii(item.value ?? "") })),
          otherLines: [...qcLegend(invalidatingMask(plan.computation.keepNegativePoisson)), ...caution, ...readingNotes(plan.warnings)].map(lasAscii),
        });
        text.utf8(writer.begin(columns));
      }
      writer.rows(text, columns);
    },
  };
};

const UTF8 = new TextEncoder();

/**
 * One JSON object per sample and line (NDJSON, application/x-ndjson) for line-oriented pipelines: the row
 * index, the depth when there is one, every property (null where invalid), each derived estimate by its id,
 * and the sample's flag codes. Numbers are written as JSON.stringify writes them (ECMA-262 Number::toString),
 * null where not finite.
 */
const NULL_BYTES = UTF8.encode("null");

const ndjsonOutput = (): WellOutput => {
  // The text that closes a row, per flag mask: a well holds few distinct masks.
  const rowEnds = new Map<number, Uint8Array>();
  const rowEnd = (mask: number): Uint8Array => {
    let bytes = rowEnds.get(mask);
    if (bytes === undefined) {
      bytes = UTF8.encode(`,"flags":${JSON.stringify(flagCodesOf(mask))}}\n`);
      rowEnds.set(mask, bytes);
    }
    return bytes;
  };
  return {
    batch({ first, log, depth, derived }, text) {
      if (log.length === 0) return;
      const named: [string, Float64Array][] = [
        ["index", sampleNumbers(first, log.length)],
        ...(depth === undefined ? [] : [["depth", depth] as [string, Float64Array]]),
        ...OUTPUT_PROPERTIES.map((property): [string, Float64Array] => [property.key, property.column(log)]),
        ...derivedList(derived).map((column): [string, Float64Array] => [column.correlation.id, column.values]),
      ];
      const keys = named.map(([key], c) => UTF8.encode(`${c === 0 ? "{" : ","}${JSON.stringify(key)}:`));
      const columns = named.map(([, values]) => values);
      const fullDoubles = fullDoublesOf(columns, columns.map(() => SHORTEST));
      // Short pieces are copied byte by byte (AsciiText.copy): cheaper than a native copy call for each.
      for (let i = 0; i < log.length; i++) {
        for (let c = 0; c < keys.length; c++) {
          text.copy(keys[c], 0, keys[c].length);
          const value = columns[c][i];
          if (Number.isFinite(value)) writeColumnValue(text, value, SHORTEST, fullDoubles[c]);
          else text.copy(NULL_BYTES, 0, NULL_BYTES.length);
        }
        const closing = rowEnd(log.flags[i]);
        text.copy(closing, 0, closing.length);
      }
    },
  };
};

/** The writer of one output format for a file of this header, converted under this plan; `digits` as the query gave it. */
export const createWellOutput = (format: TextFormat, header: WellHeader, plan: ConversionPlan, digits: string | undefined): WellOutput =>
  format === "csv" ? csvOutput(header, plan, computedFormat(digits)) : format === "las" ? lasOutput(header, plan, computedFormat(digits)) : ndjsonOutput();
