import { DENSITY_UNITS, MODULUS_UNITS, SLOWNESS_UNITS, VELOCITY_UNITS } from "../units.js";

/**
 * Units in which a source states an input, for each quantity we pass in fixed units.
 * A compressional slowness Δt (µs/ft) is derived from Vp, so `us/ft` is a unit of Vp here.
 * `1` marks a dimensionless ratio.
 */
export interface PublishedUnitsOf {
  vpMetresPerSecond: "m/s" | "km/s" | "us/ft";
  densityKilogramsPerCubicMetre: "g/cm3";
  dynamicYoungsModulusPascals: "GPa" | "Mpsi";
  staticYoungsModulusPascals: "GPa" | "Mpsi";
  poissonsRatio: "1";
}
export type PublishedInputUnit = PublishedUnitsOf[keyof PublishedUnitsOf];

/** Converts a value from our fixed unit (m/s, kg/m3, Pa, ratio) to the published unit. */
export const FROM_FIXED_UNIT: Readonly<Record<PublishedInputUnit, (value: number) => number>> = {
  "m/s": (v) => v,
  "km/s": (v) => v / VELOCITY_UNITS["km/s"],
  "us/ft": (v) => SLOWNESS_UNITS["us/ft"] / v,
  "g/cm3": (rho) => rho / DENSITY_UNITS["g/cm3"],
  GPa: (pascals) => pascals / MODULUS_UNITS.GPa,
  Mpsi: (pascals) => pascals / MODULUS_UNITS.Mpsi,
  "1": (ratio) => ratio,
};

/** Unit in which each kind of prediction is reported. */
export type OutputUnit = "GPa" | "MPa" | "deg" | "m/s" | "g/cm3" | "%";
/** Unit in which a source's formula yields its prediction. */
export type PublishedOutputUnit = OutputUnit | "Mpsi" | "km/s";

/** For each published output unit, the reported unit and the factor that converts to it. */
export const PUBLISHED_OUTPUT_UNITS: Readonly<Record<PublishedOutputUnit, { reportedAs: OutputUnit; factor: number }>> = {
  GPa: { reportedAs: "GPa", factor: 1 },
  Mpsi: { reportedAs: "GPa", factor: MODULUS_UNITS.Mpsi / MODULUS_UNITS.GPa },
  MPa: { reportedAs: "MPa", factor: 1 },
  deg: { reportedAs: "deg", factor: 1 },
  "m/s": { reportedAs: "m/s", factor: 1 },
  "km/s": { reportedAs: "m/s", factor: VELOCITY_UNITS["km/s"] },
  "g/cm3": { reportedAs: "g/cm3", factor: 1 },
  "%": { reportedAs: "%", factor: 1 },
};
