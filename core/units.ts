/** Exact length of the international foot in metres (international yard and pound agreement, 1959). */
export const METRES_PER_FOOT = 0.3048;
/**
 * Pascals in one pound-force per square inch: 0.45359237 kg × 9.80665 m/s² / (0.0254 m)², exact by the definitions
 * of the pound, standard gravity and the inch (NIST SP 811, appendix B), = 6894.757293168361336… Pa; this is the
 * double nearest to it (NIST's table B.8 rounds it to 6.894 757 E+03).
 */
export const PASCALS_PER_PSI = 6894.757293168362;

/** Metres per second in one unit of each velocity unit. */
export const VELOCITY_UNITS = { "m/s": 1, "km/s": 1000, "ft/s": METRES_PER_FOOT } as const;
export type VelocityUnit = keyof typeof VELOCITY_UNITS;

/**
 * For each slowness unit, the constant c with velocity [m/s] = c / slowness.
 * 1 µs/ft = 1e-6 s / 0.3048 m, so c = 0.3048e6 = 304800 exactly; kept as one constant
 * so that converting a slowness costs a single rounding.
 */
export const SLOWNESS_UNITS = { "us/ft": 304800, "us/m": 1e6 } as const;
export type SlownessUnit = keyof typeof SLOWNESS_UNITS;

/** Kilograms per cubic metre in one unit of each density unit. */
export const DENSITY_UNITS = { "g/cm3": 1000, "kg/m3": 1 } as const;
export type DensityUnit = keyof typeof DENSITY_UNITS;

/** Pascals in one unit of each modulus (stress) unit. */
export const MODULUS_UNITS = {
  GPa: 1e9,
  MPa: 1e6,
  Pa: 1,
  psi: PASCALS_PER_PSI,
  Mpsi: PASCALS_PER_PSI * 1e6,
} as const;
export type ModulusUnit = keyof typeof MODULUS_UNITS;

/** Metres in one unit of each depth unit. */
export const DEPTH_UNITS = { m: 1, ft: METRES_PER_FOOT } as const;
export type DepthUnit = keyof typeof DEPTH_UNITS;

/** Kilograms per square metre per second in one unit of each acoustic-impedance unit. */
export const IMPEDANCE_UNITS = {
  "m/s*g/cm3": 1000,
  "ft/s*g/cm3": METRES_PER_FOOT * 1000,
  "kg/m2/s": 1,
} as const;
export type ImpedanceUnit = keyof typeof IMPEDANCE_UNITS;

export const velocityToMetresPerSecond = (value: number, unit: VelocityUnit): number =>
  value * VELOCITY_UNITS[unit];

export const metresPerSecondToVelocity = (value: number, unit: VelocityUnit): number =>
  value / VELOCITY_UNITS[unit];

export const slownessToMetresPerSecond = (slowness: number, unit: SlownessUnit): number =>
  SLOWNESS_UNITS[unit] / slowness;

export const metresPerSecondToSlowness = (velocity: number, unit: SlownessUnit): number =>
  SLOWNESS_UNITS[unit] / velocity;

export const densityToKilogramsPerCubicMetre = (value: number, unit: DensityUnit): number =>
  value * DENSITY_UNITS[unit];

export const pascalsToModulus = (pascals: number, unit: ModulusUnit): number =>
  pascals / MODULUS_UNITS[unit];

export const modulusToPascals = (value: number, unit: ModulusUnit): number =>
  value * MODULUS_UNITS[unit];
