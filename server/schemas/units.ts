import { z } from "zod";
import {
  DENSITY_UNITS,
  DEPTH_UNITS,
  IMPEDANCE_UNITS,
  MODULUS_UNITS,
  SLOWNESS_UNITS,
  VELOCITY_UNITS,
} from "../../core/index.js";

const keysOf = <T extends object>(table: T) => Object.keys(table) as [keyof T & string, ...(keyof T & string)[]];

export const velocityUnit = z
  .enum(keysOf(VELOCITY_UNITS))
  .meta({ id: "VelocityUnit", description: "Unit of velocities (Vp, Vs): metres, kilometres or feet per second." });
export const slownessUnit = z
  .enum(keysOf(SLOWNESS_UNITS))
  .meta({ id: "SlownessUnit", description: "Unit of slownesses (DTC, DTS): microseconds per foot or per metre." });
export const densityUnit = z
  .enum(keysOf(DENSITY_UNITS))
  .meta({ id: "DensityUnit", description: "Unit of bulk density (RHOB)." });
export const modulusUnit = z.enum(keysOf(MODULUS_UNITS)).meta({
  id: "ModulusUnit",
  description: "Unit of the moduli E, G, K, lambda, M. psi uses 1 psi = 6894.757293168 Pa; Mpsi is 10^6 psi.",
});
export const depthUnit = z.enum(keysOf(DEPTH_UNITS)).meta({ id: "DepthUnit", description: "Unit of depths (echoed only)." });
export const impedanceUnit = z.enum(keysOf(IMPEDANCE_UNITS)).meta({
  id: "ImpedanceUnit",
  description: "Unit of acoustic impedances: velocity times density; kg/m2/s is SI.",
});

export const DEFAULT_UNITS = {
  velocity: "m/s",
  slowness: "us/ft",
  density: "g/cm3",
  modulus: "GPa",
  depth: "m",
  impedance: "m/s*g/cm3",
} as const;

export const unitsUsed = z
  .object({
    velocity: velocityUnit,
    slowness: slownessUnit,
    density: densityUnit,
    modulus: modulusUnit,
    impedance: impedanceUnit,
    lambda_rho: z.string().meta({ description: "Unit of lambda_rho and mu_rho: the modulus unit times g/cm3." }),
  })
  .meta({ id: "UnitsUsed", description: "The units of every number in the answer, inputs and outputs." });
