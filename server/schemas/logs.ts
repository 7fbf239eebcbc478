import { z } from "zod";
import { queryNumber } from "./query-number.js";
import { correlationIdText, fillMode } from "./correlations.js";
import { elasticColumnsResponse } from "./elastic.js";
import { limitFields } from "./limits.js";
import { impedanceUnit, modulusUnit, velocityUnit, DEFAULT_UNITS } from "./units.js";
import { zoneSummarySchema } from "./zones.js";

/** Content types under which the body of `POST /v1/logs` is the well file itself. */
export const RAW_FILE_TYPES = ["text/plain", "text/csv", "application/octet-stream", "application/x-www-form-urlencoded", "application/x-las"];

const WELL_FILE = "The well file's bytes: LAS 2.0 (CWLS) or RFC 4180 CSV with a header row, UTF-8 unless charset= says otherwise.";

/** One object for every raw content type, so that the YAML writes it once. */
const RAW_FILE_CONTENT = { schema: { type: "string", format: "binary", description: WELL_FILE } } as const;

/**
 * The request body of `POST /v1/logs` for openapi.yaml. The route reads the body as a stream, so no schema
 * validates it and the type provider cannot describe it: openapi-components.ts adds this to the operation.
 */
export const logsRequestBody = {
  required: true,
  description: `A LAS 2.0 or CSV file, sent as the body itself (${RAW_FILE_TYPES.join(", ")}; or no Content-Type at all), or as the file part of a multipart/form-data upload with an optional zones part.`,
  content: {
    ...Object.fromEntries(RAW_FILE_TYPES.map((type) => [type, RAW_FILE_CONTENT])),
    "multipart/form-data": {
      schema: {
        type: "object",
        required: ["file"],
        additionalProperties: false,
        properties: {
          file: { type: "string", format: "binary", description: `${WELL_FILE} Sent with a filename (curl -F file=@well.las).` },
          zones: {
            type: "string",
            description: "Optional: the zones as a JSON array of {name, top, base} (depths in the well's depth unit), as a field or a file (curl -F zones=@zones.json); not together with the zones query parameter.",
          },
        },
      },
    },
  },
} as const;

const curveName = (role: string) =>
  z.string().min(1).max(100).optional().meta({ description: `Name of the curve (LAS mnemonic or CSV column) to use as ${role}; detected from mnemonics and units when absent.` });
const unitSpelling = (role: string, example: string) =>
  z.string().min(1).max(40).optional().meta({ description: `Unit of the ${role} curve, overriding the file's (any accepted spelling, e.g. ${example}).` });

export const logsQuery = z.strictObject({
  vp_curve: curveName("the compressional sonic (velocity or slowness)"),
  vs_curve: curveName("the shear sonic (velocity or slowness)"),
  rho_curve: curveName("the bulk density"),
  depth_curve: curveName("the depth (index)"),
  vp_unit: unitSpelling("compressional", "us/ft, US/F, m/s"),
  vs_unit: unitSpelling("shear", "us/ft, US/F, km/s"),
  rho_unit: unitSpelling("density", "g/cm3, G/C3, kg/m3"),
  depth_unit: unitSpelling("depth", "m, FT"),
  format: z
    .enum(["json", "csv", "las", "ndjson"])
    .optional()
    .meta({ description: "Answer format; overrides Accept (application/json, text/csv, application/x-las, application/x-ndjson)." }),
  digits: z
    .string()
    .regex(/^(exact|[1-9]|1[0-5])$/, "expected a whole number from 1 to 15, or exact")
    .optional()
    .meta({
      description:
        "Significant digits of the computed values in CSV and LAS answers (1–15, default 8, correctly rounded, trailing zeros dropped), or `exact` for the shortest text that reads back as the same double. Input curves are always written back exactly as read; JSON and NDJSON answers always carry full doubles.",
    }),
  modulus_unit: modulusUnit.default(DEFAULT_UNITS.modulus),
  velocity_unit: velocityUnit.default(DEFAULT_UNITS.velocity).meta({ description: "Unit of the vp and vs columns of the answer." }),
  impedance_unit: impedanceUnit.default(DEFAULT_UNITS.impedance),
  keep_negative_poisson: z.stringbool().default(false).meta({ description: "Keep the values of samples with sqrt(4/3) < Vp/Vs < sqrt(2), flagged suspect." }),
  null_value: queryNumber().optional().meta({ description: "Value marking an absent sample; default: the file's NULL (LAS ~Well), else -999.25." }),
  zones: z
    .string()
    .max(20_000)
    .refine((text) => text.trim() !== "", "is empty: give zones as name:top:base separated by ;, or leave the parameter out")
    .optional()
    .meta({
      description: "Zones to summarise, as name:top:base separated by ; in the depth unit of the file (e.g. Linnet_Sand:1522.4:1561.8;Sorrel_Shale:1561.8:1640.3); top and base are decimal numbers, an empty entry is refused, one trailing ; is allowed. A multipart upload may instead send a `zones` part holding a JSON array of {name, top, base}.",
    }),
  correlations: correlationIdText()
    .optional()
    .meta({ description: "Comma-separated ids of empirical correlations to apply to every sample (GET /v1/correlations). Per-zone lists go in the zones part of a multipart upload." }),
  vs_from: z.string().optional().meta({ description: "Id of a vs correlation predicting Vs from Vp where the shear log is absent (or has no curve at all); filled samples are flagged estimated_vs." }),
  rho_from: z.string().optional().meta({ description: "Id of a density correlation predicting bulk density from Vp where the density log is absent; filled samples are flagged estimated_rho." }),
  fill: fillMode.optional(),
  ...limitFields,
});

const roleChoice = z
  .object({
    mnemonic: z.string(),
    index: z.int().meta({ description: "Column of the curve in the file, from 0." }),
    measure: z.enum(["velocity", "slowness", "density", "depth"]),
    unit: z.string(),
    unit_as_written: z.string(),
    unit_source: z.enum(["file", "query", "assumed"]),
    reason: z.string().meta({ description: "Why this curve was chosen and how its unit was read." }),
  })
  .meta({ id: "CurveChoice" });

export const logsJsonResponse = elasticColumnsResponse
  .extend({
    input_format: z.enum(["las", "csv"]),
    well: z
      .object({
        name: z.string().nullable(),
        company: z.string().nullable(),
        field: z.string().nullable(),
        location: z.string().nullable(),
        date: z.string().nullable(),
        unique_well_id: z.string().nullable(),
        las_version: z.string().nullable(),
        wrapped: z.boolean().nullable(),
        null_value: z.number(),
      })
      .meta({ description: "Header facts of the well (LAS ~Well); null where the file gives none (always for CSV)." }),
    curves: z
      .object({ vp: roleChoice, vs: roleChoice.optional(), rho: roleChoice.optional(), depth: roleChoice.optional() })
      .meta({ description: "Which curve was used for what, and why (vs or rho absent when predicted for every sample)." }),
    input_curves: z.array(z.object({ mnemonic: z.string(), unit: z.string(), description: z.string() })),
    warnings: z.array(z.object({ line: z.int().optional(), message: z.string() })).meta({ description: "Things in the file worth knowing that did not stop the conversion, and zones that hold no sample (outside the log's depths, as with tops in feet for a log in metres, or between its samples), with the log's first and last depth." }),
    zones: z.array(zoneSummarySchema).optional(),
  })
  .meta({ id: "WellConversion", description: "A whole well converted: columns row-aligned with the file's rows, plus how the file was read." });

export type LogsQuery = z.infer<typeof logsQuery>;
