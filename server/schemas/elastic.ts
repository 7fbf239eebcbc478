import { z } from "zod";
import { USUAL_NULL_VALUE } from "../../core/index.js";
import { decimalNumber, queryNumber } from "./query-number.js";
import { flagSummary, pointFlag, sampleFlag, severity } from "./flags.js";
import { bodyLimitFields, limitFields, limitsUsed } from "./limits.js";
import { correlationIds, correlationIdText, correlationOptions, derivedColumns, derivedPoint, fillCorrelations, fillMode } from "./correlations.js";
import { zoneList, zoneSummarySchema } from "./zones.js";
import { densityUnit, depthUnit, impedanceUnit, modulusUnit, slownessUnit, unitsUsed, velocityUnit, DEFAULT_UNITS } from "./units.js";

const DEFAULT_NULL_VALUE = USUAL_NULL_VALUE;

const pointValue = (description: string, example: number) =>
  // Examples sit on the inner number: the JSON Schema of a preprocessed value is its inner schema's.
  queryNumber(decimalNumber().meta({ examples: [example] })).optional().meta({ description });

const keepNegativePoisson = z
  .stringbool()
  .default(false)
  .meta({
    description:
      "When true, samples with sqrt(4/3) < Vp/Vs < sqrt(2) (negative Poisson's ratio) keep their computed values, flagged vp_vs_below_sqrt2 as suspect instead of invalid. Accepts true/false (also 1/0, yes/no).",
  });

type Inputs = { vp?: unknown; dtc?: unknown; vs?: unknown; dts?: unknown; rho?: unknown; vs_from?: string; rho_from?: string };

/** Exactly one of vp/dtc; one of vs/dts unless vs_from predicts Vs; rho unless rho_from predicts it. */
const inputChoice = (value: Inputs, ctx: z.RefinementCtx) => {
  for (const [velocity, slowness] of [
    ["vp", "dtc"],
    ["vs", "dts"],
  ] as const) {
    const given = [velocity, slowness].filter((name) => value[name] !== undefined);
    if (given.length === 2) {
      ctx.addIssue({ code: "custom", path: [slowness], message: `give either ${velocity} or ${slowness}, not both` });
    } else if (given.length === 0 && !(velocity === "vs" && value.vs_from !== undefined)) {
      ctx.addIssue({
        code: "custom",
        path: [velocity],
        message: `give ${velocity} (velocity) or ${slowness} (slowness); use the null value (-999.25) for a sample where it was not logged${velocity === "vs" ? ", or vs_from to predict Vs from Vp" : ""}`,
      });
    }
  }
  if (value.rho === undefined && value.rho_from === undefined) {
    ctx.addIssue({ code: "custom", path: ["rho"], message: "rho (bulk density) is required, or rho_from to predict it from Vp" });
  }
};

const fillFields = {
  vs_from: z.string().optional().meta({ description: "Id of a vs correlation (e.g. vs.castagna1985) that predicts Vs from Vp where Vs is absent; filled samples are flagged estimated_vs.", examples: ["vs.castagna1985"] }),
  rho_from: z.string().optional().meta({ description: "Id of a density correlation (density.gardner1974) that predicts bulk density from Vp where it is absent; filled samples are flagged estimated_rho." }),
  fill: fillMode.optional(),
};

export const elasticPointQuery = z
  .strictObject({
    vp: pointValue("Compressional velocity, in velocity_unit.", 3200),
    vs: pointValue("Shear velocity, in velocity_unit.", 1800),
    dtc: pointValue("Compressional slowness (DTC), in slowness_unit; replaces vp.", 95.25),
    dts: pointValue("Shear slowness (DTS), in slowness_unit; replaces vs.", 169.33),
    rho: queryNumber(decimalNumber().meta({ examples: [2.45] })).optional().meta({ description: "Bulk density (RHOB), in density_unit." }),
    velocity_unit: velocityUnit.default(DEFAULT_UNITS.velocity),
    slowness_unit: slownessUnit.default(DEFAULT_UNITS.slowness),
    density_unit: densityUnit.default(DEFAULT_UNITS.density),
    modulus_unit: modulusUnit.default(DEFAULT_UNITS.modulus),
    impedance_unit: impedanceUnit.default(DEFAULT_UNITS.impedance),
    keep_negative_poisson: keepNegativePoisson,
    null_value: queryNumber(decimalNumber().meta({ default: DEFAULT_NULL_VALUE }))
      .default(DEFAULT_NULL_VALUE)
      .meta({ description: "An input equal to this is absent (flag missing)." }),
    correlations: correlationIdText()
      .optional()
      .meta({ description: "Comma-separated ids of empirical correlations to apply (GET /v1/correlations), e.g. static_e.lacy1997_sandstone,ucs.mcnally1987.", examples: ["static_e.lacy1997_sandstone,ucs.mcnally1987"] }),
    ...fillFields,
    ...limitFields,
  })
  .superRefine(inputChoice);

const propertyValue = (description: string) => z.number().nullable().meta({ description });

export const elasticPointResponse = z
  .object({
    E: propertyValue("Young's modulus, in the modulus unit; null when the sample is invalid."),
    nu: propertyValue("Poisson's ratio (dimensionless)."),
    G: propertyValue("Shear modulus (mu, Lamé's second parameter)."),
    K: propertyValue("Bulk modulus."),
    lambda: propertyValue("Lamé's first parameter."),
    M: propertyValue("P-wave modulus, rho*Vp^2 = K + 4G/3."),
    vp_vs: propertyValue("Vp/Vs ratio."),
    p_impedance: propertyValue("Acoustic (P) impedance rho*Vp, in the impedance unit."),
    s_impedance: propertyValue("Shear impedance rho*Vs, in the impedance unit."),
    lambda_rho: propertyValue("lambda*rho, in the modulus unit times g/cm3."),
    mu_rho: propertyValue("mu*rho = G*rho, in the modulus unit times g/cm3."),
    vp: propertyValue("Compressional velocity used (from vp or dtc), in the velocity unit; null when unusable."),
    vs: propertyValue("Shear velocity used (from vs or dts), in the velocity unit; null when unusable."),
    rho: propertyValue("Bulk density used (measured, or predicted by rho_from), in units.density (the unit the density was given in); null when unusable."),
    valid: z.boolean().meta({ description: "False when an invalid flag made the moduli null." }),
    flags: z.array(pointFlag),
    fill_correlations: fillCorrelations.optional(),
    derived: derivedPoint.optional(),
    caution: z.string().optional().meta({ description: "Present whenever the answer rests on an empirical correlation (correlations, vs_from, rho_from)." }),
    units: unitsUsed,
    limits: limitsUsed,
  })
  .meta({ id: "ElasticPoint", description: "Dynamic elastic properties of one sample, with its QC flags." });

/** The schemas made by `column`, so the body's column fields are known from the schema itself. */
const columnSchemas = new Set<z.ZodType>();

const column = (description: string) => {
  const schema = z
    .custom<unknown[] | Float64Array>((value) => Array.isArray(value) || value instanceof Float64Array, {
      message: "expected an array of numbers and nulls",
    })
    .optional()
    .meta({ type: "array", items: { type: ["number", "null"] }, description });
  columnSchemas.add(schema);
  return schema;
};

export const elasticColumnsBody = z
  .strictObject({
    depth: column("Depth of each sample (echoed, optional). Cannot be given with top/base."),
    top: column("Top depth of each interval (interval input, with base)."),
    base: column("Base depth of each interval (interval input, with top)."),
    vp: column("Compressional velocity per sample, in units.velocity."),
    vs: column("Shear velocity per sample, in units.velocity."),
    dtc: column("Compressional slowness per sample, in units.slowness; replaces vp."),
    dts: column("Shear slowness per sample, in units.slowness; replaces vs."),
    rho: column("Bulk density per sample, in units.density. Required."),
    units: z
      .strictObject({
        velocity: velocityUnit.default(DEFAULT_UNITS.velocity),
        slowness: slownessUnit.default(DEFAULT_UNITS.slowness),
        density: densityUnit.default(DEFAULT_UNITS.density),
        modulus: modulusUnit.default(DEFAULT_UNITS.modulus),
        depth: depthUnit.default(DEFAULT_UNITS.depth),
        impedance: impedanceUnit.default(DEFAULT_UNITS.impedance),
      })
      .prefault({})
      .meta({ description: "Units of the inputs and of the answer; each defaults as shown." }),
    null_value: z.number().default(DEFAULT_NULL_VALUE).meta({ description: "A value equal to this, in any column (depth, top and base too), is absent: a log value is flagged missing, a depth is echoed as null and sits in no zone. null inside arrays is absent too." }),
    keep_negative_poisson: z.boolean().default(false).meta({ description: keepNegativePoisson.description }),
    limits: z.strictObject(bodyLimitFields).prefault({}).meta({ description: "Overrides of the plausibility ranges (see LimitsUsed)." }),
    correlations: correlationIds.optional(),
    correlation_options: correlationOptions.optional(),
    ...fillFields,
    zones: zoneList.optional().meta({
      description: "Formation intervals to summarise, in the depth unit; needs depth (or top and base, whose midpoints place each interval).",
    }),
  })
  .superRefine((body, ctx) => {
    inputChoice(body, ctx);
    if (body.zones !== undefined && body.depth === undefined && body.top === undefined) {
      ctx.addIssue({ code: "custom", path: ["zones"], message: "zones need a depth column (or top and base) to place the samples" });
    }
    if (body.depth !== undefined && (body.top !== undefined || body.base !== undefined)) {
      ctx.addIssue({ code: "custom", path: ["depth"], message: "give depth for samples or top and base for intervals, not both" });
    }
    if ((body.top === undefined) !== (body.base === undefined)) {
      ctx.addIssue({ code: "custom", path: [body.top === undefined ? "top" : "base"], message: "top and base go together" });
    }
  })
  .meta({
    id: "ElasticColumnsRequest",
    description: "Columns of one value per depth sample (or interval). null, or the null_value, marks an absent value.",
    examples: [
      {
        depth: [1500.0, 1500.1524, 1500.3048],
        dtc: [95.2, 88.1, -999.25],
        dts: [170.4, 162.0, 160.2],
        rho: [2.45, 2.38, 2.41],
        units: { slowness: "us/ft", density: "g/cm3", modulus: "GPa", depth: "m" },
      },
    ],
  });

/** Fields of the body that are columns (one number or null per sample): a JSON body's are read straight into Float64Arrays. */
export const elasticColumnFields: ReadonlySet<string> = new Set(
  Object.entries(elasticColumnsBody.shape).flatMap(([key, schema]) => (columnSchemas.has(schema) ? [key] : [])),
);

const resultColumn = (description: string) =>
  z.array(z.number().nullable()).meta({ description: `${description} One value per input row; null where the sample is invalid.` });

/** The inputs as used: shown for invalid samples too, since they say why a sample is invalid (a Vs above Vp). */
const inputColumn = (description: string) =>
  z.array(z.number().nullable()).meta({ description: `${description} One value per input row, invalid samples included; null where the value itself is absent or unusable.` });

export const elasticColumnsResponse = z
  .object({
    count: z.int().meta({ description: "Rows in the input and in every column of the answer." }),
    depth: z.array(z.number().nullable()).optional().meta({ description: "Echo of the input depth column." }),
    top: z.array(z.number().nullable()).optional(),
    base: z.array(z.number().nullable()).optional(),
    E: resultColumn("Young's modulus."),
    nu: resultColumn("Poisson's ratio."),
    G: resultColumn("Shear modulus."),
    K: resultColumn("Bulk modulus."),
    lambda: resultColumn("Lamé's first parameter."),
    M: resultColumn("P-wave modulus."),
    vp_vs: resultColumn("Vp/Vs."),
    p_impedance: resultColumn("P impedance."),
    s_impedance: resultColumn("S impedance."),
    lambda_rho: resultColumn("lambda*rho."),
    mu_rho: resultColumn("mu*rho."),
    vp: inputColumn("Compressional velocity used, in the velocity unit."),
    vs: inputColumn("Shear velocity used (measured, or predicted by vs_from), in the velocity unit."),
    rho: inputColumn("Bulk density used (measured, or predicted by rho_from), in units.density (the unit the density was given in)."),
    flags: z.array(sampleFlag).meta({ description: "Every flag raised, in row order." }),
    flag_legend: z
      .record(z.string(), z.object({ severity, meaning: z.string() }))
      .meta({ description: "Meaning and severity (under this request's options) of each flag code present in flags." }),
    summary: flagSummary,
    units: unitsUsed.extend({ depth: depthUnit }),
    limits: limitsUsed,
    zones: z.array(zoneSummarySchema).optional().meta({ description: "Per zone and property statistics, when zones were given." }),
    derived: derivedColumns.optional(),
    filled: z.object({ vs: z.int(), rho: z.int() }).optional().meta({ description: "Samples whose Vs or density was predicted (vs_from, rho_from)." }),
    fill_correlations: fillCorrelations.optional(),
    caution: z.string().optional().meta({ description: "Present whenever the answer rests on an empirical correlation (correlations, vs_from, rho_from)." }),
  })
  .meta({ id: "ElasticColumns", description: "Dynamic elastic properties per sample, row-aligned with the input." });

export type ElasticPointQuery = z.infer<typeof elasticPointQuery>;
export type ElasticColumnsBody = z.infer<typeof elasticColumnsBody>;

/**
 * Options of an Arrow body (`application/vnd.apache.arrow.stream`), which carries only columns: the rest of
 * the JSON body's fields, as query parameters. Correlations and zones are for JSON bodies.
 */
export const elasticArrowQuery = z.strictObject({
  velocity_unit: velocityUnit.optional(),
  slowness_unit: slownessUnit.optional(),
  density_unit: densityUnit.optional(),
  modulus_unit: modulusUnit.optional(),
  depth_unit: depthUnit.optional(),
  impedance_unit: impedanceUnit.optional(),
  null_value: queryNumber().optional().meta({ description: "A value equal to this, in any column (depth, top and base too), is absent; default -999.25. Arrow nulls are absent too." }),
  keep_negative_poisson: z.stringbool().optional(),
  ...fillFields,
  ...limitFields,
});
export type ElasticArrowQuery = z.infer<typeof elasticArrowQuery>;

/** Fields of a JSON body that an Arrow body has no place for: what they ask for is answered in JSON only. */
export const JSON_BODY_ONLY_FIELDS = ["correlations", "correlation_options", "zones"] as const satisfies readonly (keyof typeof elasticColumnsBody.shape)[];
