import { z } from "zod";
import { FLAG_CODES, FLAGS } from "../../core/index.js";

export const flagCode = z.enum(FLAG_CODES).meta({
  id: "FlagCode",
  description: [
    "QC flag codes. Severity `invalid` means the moduli of the sample are null; `suspect` means they are returned and flagged.",
    ...FLAGS.map((flag) => `- \`${flag.code}\` (${flag.severity}): ${flag.meaning}`),
  ].join("\n"),
});

export const severity = z.enum(["invalid", "suspect"]).meta({ id: "Severity" });

export const pointFlag = z
  .object({ code: flagCode, severity, message: z.string() })
  .meta({ id: "PointFlag", description: "A QC flag raised on the single sample, with an explanation that names the values involved." });

export const sampleFlag = z
  .object({ index: z.int().nonnegative(), code: flagCode, severity })
  .meta({ id: "SampleFlag", description: "A QC flag raised on the sample at `index` (0-based row of the input columns)." });

export const flagSummary = z
  .object({
    count: z.int().meta({ description: "Samples in the request." }),
    valid: z.int().meta({ description: "Samples whose moduli were computed (no invalidating flag)." }),
    flags: z.partialRecord(flagCode, z.int()).meta({ description: "Samples carrying each flag code; codes never raised are absent." }),
  })
  .meta({ id: "FlagSummary" });
