import { CURVE_MNEMONICS, VELOCITY_MNEMONICS, type CurveRole } from "./curve-mnemonics.js";
import { InputIssues, type InputIssue } from "./input-issues.js";
import { normaliseUnit, type NormalisedUnit, type UnitKind } from "./unit-spellings.js";
import type { DensityUnit, DepthUnit, SlownessUnit, VelocityUnit } from "./units.js";
import type { CurveInfo } from "./well-table.js";

interface CurveChoiceBase {
  /** Mnemonic as in the file (with any `:2` suffix). */
  mnemonic: string;
  /** Column of the curve in the file, from 0. */
  index: number;
  /** Unit exactly as the file writes it ("" for none). */
  unitAsWritten: string;
  /** Why this curve was chosen and how its unit was read, in one sentence. */
  reason: string;
}

/** `unit` is undefined when the file gives none or one we do not recognise. */
export type SonicCurveChoice = CurveChoiceBase &
  ({ measure: "velocity"; unit: VelocityUnit | undefined } | { measure: "slowness"; unit: SlownessUnit | undefined });
export type DensityCurveChoice = CurveChoiceBase & { measure: "density"; unit: DensityUnit | undefined };
export type DepthCurveChoice = CurveChoiceBase & { measure: "depth"; unit: DepthUnit | undefined };

export interface CurveMapping {
  vp: SonicCurveChoice;
  /** Undefined only when the shear role was declared optional and no curve fits it. */
  vs: SonicCurveChoice | undefined;
  /** Undefined only when the density role was declared optional and no curve fits it. */
  rho: DensityCurveChoice | undefined;
  /** Undefined when no curve has a depth mnemonic and the first column cannot be the depth. */
  depth: DepthCurveChoice | undefined;
}

/** Curve names given explicitly by the caller, matched without regard to case. */
export type CurveOverrides = Partial<Record<CurveRole, string>>;

type Measure = UnitKind;
type CurveChoice = CurveChoiceBase & { measure: Measure; unit: NormalisedUnit["unit"] | undefined };
type UnitReading = { fits: true; unit: NormalisedUnit | undefined; clause: string } | { fits: false; clause: string };

const ROLES: readonly CurveRole[] = ["vp", "vs", "rho", "depth"];
const ROLE_UNIT_KINDS: Record<CurveRole, readonly UnitKind[]> = {
  vp: ["slowness", "velocity"],
  vs: ["slowness", "velocity"],
  rho: ["density"],
  depth: ["depth"],
};
const ROLE_TITLES: Record<CurveRole, string> = {
  vp: "compressional sonic",
  vs: "shear sonic",
  rho: "bulk density",
  depth: "depth",
};
const SONIC_WORDS = { vp: "compressional", vs: "shear" } as const;

const baseMnemonic = (mnemonic: string): string => mnemonic.trim().replace(/:\d+$/, "").toUpperCase();

const describeCurves = (curves: readonly CurveInfo[]): string =>
  curves.length === 0
    ? "the file has no curves"
    : curves.map((curve) => (curve.unit === "" ? curve.mnemonic : `${curve.mnemonic} [${curve.unit}]`)).join(", ");

const readUnit = (curve: CurveInfo, role: CurveRole): UnitReading => {
  const written = curve.unit.trim();
  if (written === "") return { fits: true, unit: undefined, clause: "the file gives no unit" };
  const unit = normaliseUnit(written);
  if (unit === undefined) return { fits: true, unit: undefined, clause: `unit ${written} is not one we recognise` };
  if (!ROLE_UNIT_KINDS[role].includes(unit.kind)) return { fits: false, clause: `unit ${written} is a ${unit.kind} unit` };
  return { fits: true, unit, clause: `unit ${written} read as ${unit.unit}` };
};

/** What a mnemonic alone says a curve of this role measures. */
const measureByName = (role: CurveRole, base: string): Measure => {
  if (role === "rho") return "density";
  if (role === "depth") return "depth";
  return VELOCITY_MNEMONICS.has(base) ? "velocity" : "slowness";
};

const commonNameClause = (curve: CurveInfo, role: CurveRole): string => {
  const what =
    role === "vp" || role === "vs"
      ? `${SONIC_WORDS[role]}-${measureByName(role, baseMnemonic(curve.mnemonic))}`
      : ROLE_TITLES[role];
  return `mnemonic ${curve.mnemonic} is a common ${what} name`;
};

const makeChoice = (
  curves: readonly CurveInfo[],
  index: number,
  role: CurveRole,
  reading: UnitReading & { fits: true },
  why: string,
): CurveChoice => {
  const curve = curves[index];
  const base = baseMnemonic(curve.mnemonic);
  const known = CURVE_MNEMONICS[role].includes(base);
  const byName = measureByName(role, base);
  const measure = reading.unit?.kind ?? byName;
  let reason = `${why}; ${reading.clause}`;
  if (role === "vp" || role === "vs") {
    if (reading.unit === undefined) {
      reason += `, so it is taken as a ${measure}${known ? " as its mnemonic says" : ", the usual form of a sonic log"}`;
    } else if (known && measure !== byName) {
      reason += `, so the curve is taken as a ${measure}`;
    }
  }
  return { mnemonic: curve.mnemonic, index, measure, unit: reading.unit?.unit, unitAsWritten: curve.unit, reason };
};

const detectRole = (
  curves: readonly CurveInfo[],
  role: CurveRole,
  taken: ReadonlySet<number>,
): { choice: CurveChoice | undefined; passedOver: string[] } => {
  const names = CURVE_MNEMONICS[role];
  const candidates: { index: number; rank: number; reading: UnitReading & { fits: true } }[] = [];
  const passedOver: string[] = [];
  curves.forEach((curve, index) => {
    const rank = names.indexOf(baseMnemonic(curve.mnemonic));
    if (rank === -1 || taken.has(index)) return;
    const reading = readUnit(curve, role);
    if (reading.fits) candidates.push({ index, rank, reading });
    else passedOver.push(`${curve.mnemonic} (its ${reading.clause})`);
  });
  candidates.sort((a, b) => a.rank - b.rank || a.index - b.index);
  const [best, runnerUp] = candidates;
  if (best === undefined) return { choice: undefined, passedOver };
  let why = commonNameClause(curves[best.index], role);
  if (runnerUp !== undefined) {
    const others = candidates.slice(1).map((candidate) => curves[candidate.index].mnemonic).join(", ");
    const rule = runnerUp.rank === best.rank ? "as the first in the file" : "as the better-known mnemonic";
    why += ` (${others} also ${candidates.length > 2 ? "fit" : "fits"}; ${curves[best.index].mnemonic} preferred ${rule})`;
  }
  return { choice: makeChoice(curves, best.index, role, best.reading, why), passedOver };
};

const findCurve = (curves: readonly CurveInfo[], name: string): number => {
  const exact = curves.findIndex((curve) => curve.mnemonic === name);
  if (exact !== -1) return exact;
  const wanted = name.trim().toUpperCase();
  return curves.findIndex((curve) => curve.mnemonic.toUpperCase() === wanted);
};

const missingMessage = (curves: readonly CurveInfo[], role: CurveRole, passedOver: readonly string[]): string =>
  `no ${ROLE_TITLES[role]} curve found: looked for the mnemonics ${CURVE_MNEMONICS[role].join(", ")} (any case) ` +
  `with a ${ROLE_UNIT_KINDS[role].join(" or ")} unit or none` +
  (passedOver.length > 0 ? `, and passed over ${passedOver.join(", ")}` : "") +
  `; curves present: ${describeCurves(curves)}. Name the curve with ${role}_curve`;

const firstColumnAsDepth = (curves: readonly CurveInfo[]): CurveChoice | undefined => {
  const reading = readUnit(curves[0], "depth");
  if (!reading.fits) return undefined;
  const why =
    `no curve has a common depth mnemonic (${CURVE_MNEMONICS.depth.join(", ")}), ` +
    `so the first column, ${curves[0].mnemonic}, is taken as the depth`;
  return makeChoice(curves, 0, "depth", reading, why);
};

/**
 * Chooses the compressional sonic, shear sonic, bulk density and depth curves of a file.
 * An override names the curve of its role; otherwise the role goes to a curve with one of the
 * role's common mnemonics (see `CURVE_MNEMONICS`, ignoring case and a `:2` suffix) whose unit,
 * if recognised, measures the right thing. A recognised unit decides velocity against slowness.
 * With no depth mnemonic the first column is the depth, if free and not in a unit of another kind.
 * A curve fills one role at most: detection passes over the curves already chosen.
 * Throws `InputIssues` (fields `vp_curve`, `vs_curve`, `rho_curve`, `depth_curve`) listing every
 * override that names no curve, a curve of the wrong kind or a curve another override names, and every role left without a curve
 * (except the `optional` ones, e.g. the shear role when Vs will be predicted from Vp).
 */
export const detectCurves = (
  curves: readonly CurveInfo[],
  overrides: CurveOverrides = {},
  optional: readonly ("vs" | "rho")[] = [],
): CurveMapping => {
  const issues: InputIssue[] = [];
  const chosen: Partial<Record<CurveRole, CurveChoice>> = {};
  const taken = new Set<number>();
  for (const role of ROLES) {
    const name = overrides[role];
    if (name === undefined) continue;
    const field = `${role}_curve`;
    const index = findCurve(curves, name);
    if (index === -1) {
      issues.push({ field, message: `no curve is named ${name}; the curves are: ${describeCurves(curves)}` });
      continue;
    }
    const reading = readUnit(curves[index], role);
    if (!reading.fits) {
      issues.push({
        field,
        message:
          `curve ${curves[index].mnemonic} cannot be the ${ROLE_TITLES[role]}: ` +
          `its ${reading.clause}, not a ${ROLE_UNIT_KINDS[role].join(" or ")} unit`,
      });
      continue;
    }
    // One curve cannot measure two things: the same curve as Vp and Vs makes every sample Vs = Vp.
    const other = ROLES.find((earlier) => chosen[earlier]?.index === index);
    if (other !== undefined) {
      issues.push({
        field,
        message:
          `curve ${curves[index].mnemonic} is named for two roles, the ${ROLE_TITLES[other]} (${other}_curve) and the ` +
          `${ROLE_TITLES[role]} (${field}); name a different curve for one of them`,
      });
      continue;
    }
    chosen[role] = makeChoice(curves, index, role, reading, `named by ${field}`);
    taken.add(index);
  }
  for (const role of ROLES) {
    if (overrides[role] !== undefined) continue;
    const { choice, passedOver } = detectRole(curves, role, taken);
    if (choice === undefined) {
      if (role !== "depth" && !(optional as readonly CurveRole[]).includes(role)) {
        issues.push({ field: `${role}_curve`, message: missingMessage(curves, role, passedOver) });
      }
      continue;
    }
    chosen[role] = choice;
    taken.add(choice.index);
  }
  if (overrides.depth === undefined && chosen.depth === undefined && curves.length > 0 && !taken.has(0)) {
    chosen.depth = firstColumnAsDepth(curves);
  }
  if (issues.length > 0) throw new InputIssues(issues);
  return {
    vp: chosen.vp as SonicCurveChoice,
    vs: chosen.vs as SonicCurveChoice | undefined,
    rho: chosen.rho as DensityCurveChoice | undefined,
    depth: chosen.depth as DepthCurveChoice | undefined,
  };
};
