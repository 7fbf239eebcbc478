import type { DensityUnit, ElasticLog, ImpedanceUnit, ModulusUnit, VelocityUnit } from "../core/index.js";

export interface OutputUnits {
  velocity: VelocityUnit;
  /** The density input's unit, which the answer's rho keeps. */
  density: DensityUnit;
  modulus: ModulusUnit;
  impedance: ImpedanceUnit;
}

/** One computed property as every output format names it. */
export interface OutputProperty {
  /** Key in JSON answers. */
  key: string;
  /** Column name in CSV and LAS output (our own names, prefixed EL_; an input curve of the same name is renamed, EL_E:2 or EL_E_2). */
  curve: string;
  description: string;
  unit: (units: OutputUnits) => string;
  column: (log: ElasticLog) => Float64Array;
}

const modulus = (units: OutputUnits) => units.modulus;
const modulusDensity = (units: OutputUnits) => `${units.modulus}*g/cm3`;

/** The computed properties, in answer order. */
export const OUTPUT_PROPERTIES = [
  { key: "E", curve: "EL_E", description: "DYNAMIC YOUNGS MODULUS", unit: modulus, column: (log) => log.youngsModulus },
  { key: "nu", curve: "EL_NU", description: "DYNAMIC POISSONS RATIO", unit: () => "", column: (log) => log.poissonsRatio },
  { key: "G", curve: "EL_G", description: "DYNAMIC SHEAR MODULUS", unit: modulus, column: (log) => log.shearModulus },
  { key: "K", curve: "EL_K", description: "DYNAMIC BULK MODULUS", unit: modulus, column: (log) => log.bulkModulus },
  { key: "lambda", curve: "EL_LAMBDA", description: "LAME FIRST PARAMETER", unit: modulus, column: (log) => log.lameLambda },
  { key: "M", curve: "EL_M", description: "P-WAVE MODULUS", unit: modulus, column: (log) => log.pWaveModulus },
  { key: "vp_vs", curve: "EL_VPVS", description: "VP/VS RATIO", unit: () => "", column: (log) => log.vpVsRatio },
  { key: "p_impedance", curve: "EL_IP", description: "P IMPEDANCE RHO*VP", unit: (u) => u.impedance, column: (log) => log.pImpedance },
  { key: "s_impedance", curve: "EL_IS", description: "S IMPEDANCE RHO*VS", unit: (u) => u.impedance, column: (log) => log.sImpedance },
  { key: "lambda_rho", curve: "EL_LAMRHO", description: "LAMBDA*RHO", unit: modulusDensity, column: (log) => log.lambdaRho },
  { key: "mu_rho", curve: "EL_MURHO", description: "MU*RHO", unit: modulusDensity, column: (log) => log.muRho },
  { key: "vp", curve: "EL_VP", description: "COMPRESSIONAL VELOCITY USED", unit: (u) => u.velocity, column: (log) => log.vp },
  { key: "vs", curve: "EL_VS", description: "SHEAR VELOCITY USED", unit: (u) => u.velocity, column: (log) => log.vs },
  { key: "rho", curve: "EL_RHO", description: "BULK DENSITY USED", unit: (u) => u.density, column: (log) => log.rho },
] as const satisfies readonly OutputProperty[];

export type PropertyKey = (typeof OUTPUT_PROPERTIES)[number]["key"];

/** Name of the QC flag curve in CSV and LAS output: the sample's flag bit mask as an integer. */
export const QC_CURVE = "EL_QC";

/** Columns keyed as in JSON answers, for zone statistics. */
export const propertyColumns = (log: ElasticLog): Record<PropertyKey, Float64Array> =>
  Object.fromEntries(OUTPUT_PROPERTIES.map((property) => [property.key, property.column(log)])) as Record<PropertyKey, Float64Array>;
