import { flagBit } from "./qc-flags.js";
import {
  DENSITY_UNITS,
  SLOWNESS_UNITS,
  VELOCITY_UNITS,
  type DensityUnit,
  type SlownessUnit,
  type VelocityUnit,
} from "./units.js";

/** A sonic curve as measured: a velocity or a slowness, in its unit. */
export type SonicCurve =
  | { readonly measure: "velocity"; readonly unit: VelocityUnit; readonly values: Float64Array }
  | { readonly measure: "slowness"; readonly unit: SlownessUnit; readonly values: Float64Array };

export interface DensityCurve {
  readonly unit: DensityUnit;
  readonly values: Float64Array;
}

const MISSING = flagBit("missing");
const NOT_FINITE = flagBit("not_finite");
const NON_POSITIVE = flagBit("non_positive");

/**
 * Flags absent (NaN, i.e. JSON null, or equal to `nullValue`), infinite and non-positive raw values;
 * returns the bit to set, or 0 for a usable value.
 */
const screenBit = (value: number, nullValue: number): number => {
  if (Number.isNaN(value) || value === nullValue) return MISSING;
  if (value === Infinity || value === -Infinity) return NOT_FINITE;
  return value <= 0 ? NON_POSITIVE : 0;
};

// Two plain loops rather than one loop with a conversion callback: the callback made the hot loop
// polymorphic and several times slower on whole wells.
// A finite input whose SI value is not (1e300 g/cm3, a slowness of 1e-320) is flagged not_finite, like an infinite one.
const screenScaled = (raw: Float64Array, nullValue: number, flags: Uint32Array, factor: number): Float64Array => {
  const si = new Float64Array(raw.length);
  for (let i = 0; i < raw.length; i++) {
    const bit = screenBit(raw[i], nullValue);
    const value = raw[i] * factor;
    if (bit === 0 && value !== Infinity) si[i] = value;
    else {
      flags[i] |= bit === 0 ? NOT_FINITE : bit;
      si[i] = NaN;
    }
  }
  return si;
};

const screenInverted = (raw: Float64Array, nullValue: number, flags: Uint32Array, constant: number): Float64Array => {
  const si = new Float64Array(raw.length);
  for (let i = 0; i < raw.length; i++) {
    const bit = screenBit(raw[i], nullValue);
    const value = constant / raw[i];
    if (bit === 0 && value !== Infinity) si[i] = value;
    else {
      flags[i] |= bit === 0 ? NOT_FINITE : bit;
      si[i] = NaN;
    }
  }
  return si;
};

/** Velocity in m/s of each sample of a sonic curve, flagging unusable samples in `flags`. */
export const sonicToMetresPerSecond = (curve: SonicCurve, nullValue: number, flags: Uint32Array): Float64Array => {
  return curve.measure === "velocity"
    ? screenScaled(curve.values, nullValue, flags, VELOCITY_UNITS[curve.unit])
    : screenInverted(curve.values, nullValue, flags, SLOWNESS_UNITS[curve.unit]);
};

/** Density in kg/m3 of each sample, flagging unusable samples in `flags`. */
export const densityToSi = (curve: DensityCurve, nullValue: number, flags: Uint32Array): Float64Array => {
  return screenScaled(curve.values, nullValue, flags, DENSITY_UNITS[curve.unit]);
};
