import type { CalibrationRange } from "./calibration-range.js";
import type { OptionRange } from "./option-range.js";
import type { OutputUnit, PublishedOutputUnit, PublishedUnitsOf } from "./published-units.js";

/** What a correlation predicts. */
export const CORRELATION_KINDS = ["static_e", "ucs", "friction_angle", "vs", "density", "brittleness"] as const;
export type CorrelationKind = (typeof CORRELATION_KINDS)[number];

/** The one unit in which each kind is reported, whatever unit its source works in. */
export const KIND_OUTPUT_UNITS: Readonly<Record<CorrelationKind, OutputUnit>> = {
  static_e: "GPa",
  ucs: "MPa",
  friction_angle: "deg",
  vs: "m/s",
  density: "g/cm3",
  brittleness: "%",
};

/**
 * Rock a correlation was fitted to:
 * `any` — every lithology of the source's data set; `clastic` — sandstones and shales (mudrocks) together;
 * `carbonate` — limestones and dolomites together; `hard_rock` and `soft_rock` — split by stiffness as the source does;
 * the others are the single lithology named.
 */
export const LITHOLOGIES = [
  "any",
  "clastic",
  "sandstone",
  "shale",
  "carbonate",
  "limestone",
  "dolomite",
  "hard_rock",
  "soft_rock",
] as const;
export type Lithology = (typeof LITHOLOGIES)[number];

/**
 * Quantities a correlation may take, always in these units, so a caller never converts per correlation:
 * Vp in m/s (a compressional slowness is derived from it), bulk density in kg/m3, Young's moduli in Pa,
 * Poisson's ratio as a ratio. A static Young's modulus is one measured in the laboratory or predicted by a
 * `static_e` correlation; a dynamic one is computed from sonic and density logs.
 */
export const INPUT_QUANTITIES = [
  "vpMetresPerSecond",
  "densityKilogramsPerCubicMetre",
  "dynamicYoungsModulusPascals",
  "staticYoungsModulusPascals",
  "poissonsRatio",
] as const satisfies readonly (keyof PublishedUnitsOf)[];
export type InputQuantity = (typeof INPUT_QUANTITIES)[number];

/** Columns of input quantities, one value per sample; NaN where absent. */
export type CorrelationInputs = Partial<Record<InputQuantity, Float64Array>>;

/** One input of a correlation: the quantity we pass and how the source writes it. */
export type CorrelationInput = {
  [Q in InputQuantity]: {
    readonly quantity: Q;
    /** Symbol in the published formula, e.g. `Δt`. */
    readonly symbol: string;
    /** Unit of that symbol in the published formula; evaluate converts to it before applying the formula. */
    readonly unit: PublishedUnitsOf[Q];
    /** Range of the source's data for this input, in `unit`; undefined where none is published. */
    readonly range: CalibrationRange | undefined;
  };
}[InputQuantity];

/** A number a request may set for one evaluation, e.g. the normalisation bounds of a brittleness index. */
export interface CorrelationOption {
  readonly name: string;
  readonly unit: string;
  readonly defaultValue: number;
  readonly description: string;
  /** Values a request may give; anything else is refused. */
  readonly accepted: OptionRange;
  /** The option this one is the lower bound of: after defaults it must stay below it by MIN_RELATIVE_SPAN. */
  readonly below?: string;
}

/** Option values by name; an option left out (or undefined) takes its default. */
export type CorrelationOptions = Readonly<Record<string, number | undefined>>;

export interface Citation {
  /** Family name and initials of each author, separated by semicolons. */
  readonly authors: string;
  readonly year: number;
  readonly title: string;
  /** Journal with volume(issue) and pages, or conference with paper number. */
  readonly source: string;
  readonly doi?: string;
}

export interface CorrelationResult {
  /** Prediction per sample in the correlation's `outputUnit`; NaN where an input is NaN. */
  values: Float64Array;
  /** 1 where an input or the prediction lies outside the source's calibration range (the value is kept). */
  outsideCalibration: Uint8Array;
}

/**
 * One published empirical correlation: its data, and a pure function over columns.
 * Example: `findCorrelation("ucs.mcnally1987")?.evaluate({ vpMetresPerSecond })`.
 */
export interface Correlation {
  /** `<kind>.<first author><year>[_<variant>]`, lower case. */
  readonly id: string;
  readonly kind: CorrelationKind;
  readonly lithology: Lithology;
  /** The formula as published, in the source's units. */
  readonly formula: string;
  readonly inputs: readonly CorrelationInput[];
  readonly options: readonly CorrelationOption[];
  /** Unit the published formula yields. */
  readonly publishedOutputUnit: PublishedOutputUnit;
  /** Unit of `evaluate`'s values (see KIND_OUTPUT_UNITS). */
  readonly outputUnit: OutputUnit;
  /** Range of the predicted quantity in the source's data, in `outputUnit`; a prediction outside it is flagged. */
  readonly outputRange: CalibrationRange | undefined;
  readonly citation: Citation;
  /** The compilation that reproduces the formula, where we took it from one. */
  readonly compiledIn: Citation | undefined;
  /** Where the correlation holds, what it assumes, and what we could not check. */
  readonly caveats: string;
  readonly empirical: true;
  evaluate(inputs: CorrelationInputs, options?: CorrelationOptions): CorrelationResult;
}
