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
  description: "Unit of the moduli E, G, K, lambda, M. psi uses 1 psi = 0.45359237 kg × 9.80665 m/s² / (0.0254 m)² = 6894.757293168361… Pa; Mpsi is 10^6 psi.",
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
    velocity: velocityUnit.meta({ description: "Unit of vp and vs in the answer (and of velocities given in the request)." }),
    slowness: slownessUnit.meta({ description: "Unit slownesses (DTC, DTS) were read in; the answer holds none." }),
    density: densityUnit.meta({ description: "Unit of rho in the answer, which is the unit the density input was read in. Impedances and lambda_rho have units of their own (impedance, lambda_rho)." }),
    modulus: modulusUnit.meta({ description: "Unit of E, G, K, lambda and M in the answer." }),
    impedance: impedanceUnit.meta({ description: "Unit of p_impedance and s_impedance in the answer." }),
    lambda_rho: z.string().meta({ description: "Unit of lambda_rho and mu_rho: the modulus unit times g/cm3." }),
  })
  .meta({
    id: "UnitsUsed",
    description: "Units of the request's inputs as read and of the answer's numbers: vp and vs are in velocity, rho in density, the moduli in modulus, the impedances in impedance, lambda_rho and mu_rho in lambda_rho, Poisson's ratio and vp_vs have none. Empirical estimates carry their own unit.",
  });
