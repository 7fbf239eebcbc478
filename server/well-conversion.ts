import {
  absentAsNaN,
  acceptedSpellings,
  computeElasticLog,
  CORRELATIONS,
  depthOrderNotes,
  detectCurves,
  InputIssues,
  normaliseUnit,
  USUAL_NULL_VALUE,
  type CurveMapping,
  type CurveInfo,
  type CurveOverrides,
  type DensityUnit,
  type DepthUnit,
  type ElasticLog,
  type ElasticLogRequest,
  type InputIssue,
  type SonicCurve,
  type UnitKind,
  type VelocityUnit,
} from "../core/index.js";
import { ProblemError } from "./problems.js";
import type { WellFile } from "./well-upload.js";

type Role = "vp" | "vs" | "rho" | "depth";

/** The options of a core request, plus how to find the curves and read their units; the null value defaults to the file's. */
export type ConversionOptions = Omit<ElasticLogRequest, "compressional" | "shear" | "density" | "nullValue"> & {
  curves: CurveOverrides;
  units: Partial<Record<Role, string>>;
  nullValue: number | undefined;
};

/** How one role was filled: which curve, read in which unit, and why. */
export interface RoleChoice {
  mnemonic: string;
  index: number;
  measure: UnitKind;
  unit: string;
  unit_as_written: string;
  unit_source: "file" | "query" | "assumed";
  reason: string;
}

export interface WellConversion {
  file: WellFile;
  request: ElasticLogRequest;
  log: ElasticLog;
  curves: Partial<Record<Role, RoleChoice>>;
  depth: Float64Array | undefined;
  depthUnit: DepthUnit;
  nullValue: number;
  warnings: { line?: number; message: string }[];
}

const ROLE_KINDS: Record<Role, readonly UnitKind[]> = {
  vp: ["slowness", "velocity"],
  vs: ["slowness", "velocity"],
  rho: ["density"],
  depth: ["depth"],
};
const ASSUMED: Record<UnitKind, string> = { slowness: "us/ft", velocity: "m/s", density: "g/cm3", depth: "m" };

const spellings = (role: Role) => ROLE_KINDS[role].flatMap((kind) => acceptedSpellings(kind)).join(", ");

/**
 * The unit of a chosen curve: the query's override (with a warning when the file gives the curve another), else the
 * file's, else the usual unit of its measure (with a warning).
 */
const resolveRole = (
  role: Role,
  choice: CurveMapping[Role] & object,
  override: string | undefined,
  warnings: WellConversion["warnings"],
): RoleChoice => {
  const base = { mnemonic: choice.mnemonic, index: choice.index, unit_as_written: choice.unitAsWritten, reason: choice.reason };
  if (override !== undefined) {
    const unit = normaliseUnit(override);
    if (unit === undefined || !ROLE_KINDS[role].includes(unit.kind)) {
      throw new ProblemError("invalid-request", `${role}_unit "${override}" is not a unit for this curve.`, [
        { field: `query.${role}_unit`, message: `accepted: ${spellings(role)}` },
      ]);
    }
    const written = choice.unitAsWritten.trim();
    if (written !== "" && choice.unit !== unit.unit) {
      const kinds = choice.unit !== undefined && choice.measure !== unit.kind ? `; the curve is read as a ${unit.kind}, not a ${choice.measure}` : "";
      warnings.push({ message: `${role}_unit ${unit.unit} overrides the unit ${written} that the file gives curve ${choice.mnemonic}${kinds}` });
    }
    return { ...base, measure: unit.kind, unit: unit.unit, unit_source: "query" };
  }
  if (choice.unit !== undefined) return { ...base, measure: choice.measure, unit: choice.unit, unit_source: "file" };
  if (choice.unitAsWritten.trim() !== "") {
    throw new ProblemError(
      "unusable-file",
      `Curve ${choice.mnemonic} (used as ${role}) has the unit "${choice.unitAsWritten}", which is not one this service reads. Accepted spellings: ${spellings(role)}. Or give ${role}_unit.`,
      [{ field: `body.${choice.mnemonic}`, message: `unknown unit "${choice.unitAsWritten}"` }],
    );
  }
  const unit = ASSUMED[choice.measure];
  warnings.push({ message: `curve ${choice.mnemonic} (${role}) has no unit; read as ${unit}. Give ${role}_unit to change this.` });
  return { ...base, measure: choice.measure, unit, unit_source: "assumed" };
};

const sonic = (choice: RoleChoice, values: Float64Array): SonicCurve =>
  choice.measure === "velocity"
    ? { measure: "velocity", unit: choice.unit as VelocityUnit, values }
    : { measure: "slowness", unit: choice.unit as "us/ft", values };

/** What converting a file's rows needs, settled from its header alone: the curves, their units, the options. */
export interface ConversionPlan {
  curves: Partial<Record<Role, RoleChoice>>;
  /** The options of every core request for this file, without the columns. */
  computation: Omit<ElasticLogRequest, "compressional" | "shear" | "density">;
  depthUnit: DepthUnit;
  nullValue: number;
  warnings: { line?: number; message: string }[];
}

const GAP_FILLS = {
  vs: { option: "vs_from", predicts: "Vs", kind: "vs" },
  rho: { option: "rho_from", predicts: "bulk density", kind: "density" },
} as const;

/**
 * A missing shear or density curve (its role's issue when no curve was named for it) can be predicted from Vp
 * instead: the issue names the option, as the single-point GET does, and the correlations it takes.
 */
const withGapFill = (issue: InputIssue, overrides: CurveOverrides): InputIssue => {
  const role = issue.field === "vs_curve" ? "vs" : issue.field === "rho_curve" ? "rho" : undefined;
  if (role === undefined || overrides[role] !== undefined) return issue;
  const fill = GAP_FILLS[role];
  const ids = CORRELATIONS.filter((correlation) => correlation.kind === fill.kind).map((correlation) => correlation.id);
  return {
    ...issue,
    message: `${issue.message}, or give ${fill.option} to predict ${fill.predicts} from Vp by a published correlation (${ids.join(", ")}; GET /v1/correlations?kind=${fill.kind} describes them)`,
  };
};

/** Finds the curves and settles their units from the header (curves and null value) of a file; throws ProblemError when they cannot be. */
export const planConversion = (
  header: { curves: CurveInfo[]; nullValue: number | undefined; warnings?: readonly { line?: number; message: string }[] },
  options: ConversionOptions,
): ConversionPlan => {
  let mapping: CurveMapping;
  try {
    const optional = [...(options.fillShear ? ["vs" as const] : []), ...(options.fillDensity ? ["rho" as const] : [])];
    mapping = detectCurves(header.curves, options.curves, optional);
  } catch (error) {
    if (!(error instanceof InputIssues)) throw error;
    const issues = error.issues.map((issue) => withGapFill(issue, options.curves));
    throw new ProblemError(
      "unusable-file",
      `The curves to use could not be settled: ${new InputIssues(issues).message}.`,
      issues.map((issue) => ({ field: `query.${issue.field}`, message: issue.message })),
    );
  }
  const warnings: ConversionPlan["warnings"] = [...(header.warnings ?? [])];
  const vp = resolveRole("vp", mapping.vp, options.units.vp, warnings);
  const vs = mapping.vs && resolveRole("vs", mapping.vs, options.units.vs, warnings);
  const rho = mapping.rho && resolveRole("rho", mapping.rho, options.units.rho, warnings);
  const depth = mapping.depth && resolveRole("depth", mapping.depth, options.units.depth, warnings);
  const nullValue = options.nullValue ?? header.nullValue ?? USUAL_NULL_VALUE;
  if (options.nullValue !== undefined && header.nullValue !== undefined && options.nullValue !== header.nullValue) {
    warnings.push({
      message: `null_value ${options.nullValue} overrides the NULL ${header.nullValue} that the file declares: a sample of ${header.nullValue} is read as a value, and ${options.nullValue} marks an absent sample`,
    });
  }
  if (!vs) warnings.push({ message: `no shear curve: Vs of every sample is predicted by ${options.fillShear?.correlation.id}` });
  if (!rho) warnings.push({ message: `no density curve: bulk density of every sample is predicted by ${options.fillDensity?.correlation.id}` });
  const { curves: _curves, units: _units, nullValue: _nullValue, ...computation } = options;
  return {
    curves: { vp, ...(vs && { vs }), ...(rho && { rho }), ...(depth && { depth }) },
    computation: { ...computation, nullValue },
    depthUnit: (depth?.unit as DepthUnit | undefined) ?? "m",
    nullValue,
    warnings,
  };
};

/** The core request for some rows of a file (all of them, or a batch), one array per curve of the file. */
export const requestForRows = (plan: ConversionPlan, columns: readonly Float64Array[]): ElasticLogRequest => {
  const { vp, vs, rho } = plan.curves as Required<ConversionPlan["curves"]>;
  const rows = columns[vp.index].length;
  const absent = () => new Float64Array(rows).fill(NaN);
  return {
    ...plan.computation,
    compressional: sonic(vp, columns[vp.index]),
    shear: vs ? sonic(vs, columns[vs.index]) : { measure: "velocity", unit: "m/s", values: absent() },
    density: rho ? { unit: rho.unit as DensityUnit, values: columns[rho.index] } : { unit: "g/cm3", values: absent() },
  };
};

/** Finds the curves, settles their units, and computes the elastic log of a whole well. */
export const convertWell = (file: WellFile, options: ConversionOptions): WellConversion => {
  const plan = planConversion({ ...file.table, warnings: [...file.notes, ...(file.format === "las" ? file.las.warnings : [])] }, options);
  const request = requestForRows(plan, file.table.columns);
  const depth = plan.curves.depth;
  const depthColumn = depth && absentAsNaN(file.table.columns[depth.index], plan.nullValue);
  // A LAS file's index is checked against STRT, STOP and STEP as it is read; a CSV file's depth only here.
  if (file.format === "csv" && depth !== undefined && depthColumn !== undefined) {
    plan.warnings.push(...depthOrderNotes(depthColumn).map((message) => ({ message: `curve ${depth.mnemonic}: ${message}` })));
  }
  return {
    file,
    request,
    log: computeElasticLog(request),
    curves: plan.curves,
    // An absent depth (the null value) is NaN, as an absent value of the other curves is to the computation.
    depth: depthColumn,
    depthUnit: plan.depthUnit,
    nullValue: plan.nullValue,
    warnings: plan.warnings,
  };
};
