/**
 * Marram Bank 7, a fictional well of our own, of any length: the benchmark's data and that of its tests.
 * Beds of shale, sand and limestone with noisy slownesses and densities, and the defects real logs carry:
 * DTS not logged (empty CSV cells), RHOB at the null value, mispicked shear (Vp/Vs below √2) and swapped
 * curves (DTS below DTC). Deterministic: the same seed gives the same well.
 */
import { writeSync } from "node:fs";
import { withDefaultLimits, writeCsv, writeLas, type ElasticLogRequest } from "../core/index.js";

export const NULL_VALUE = -999.25;
const TOP_METRES = 2150;
/** Half a foot in metres, the usual wireline sampling interval. */
const STEP_METRES = 0.1524;

export interface SyntheticWell {
  depthMetres: Float64Array;
  dtcMicrosecondsPerFoot: Float64Array;
  /** NaN where the shear was not logged. */
  dtsMicrosecondsPerFoot: Float64Array;
  /** NULL_VALUE where the density was not logged. */
  rhobGramsPerCubicCentimetre: Float64Array;
}

type Lithology = "shale" | "sand" | "limestone";

/** Mean and half-spread of DTC (us/ft), Vp/Vs and RHOB (g/cm3) per lithology (common practice for brine-filled rocks). */
const ROCK: Record<Lithology, { dtc: [number, number]; vpVs: [number, number]; rhob: [number, number] }> = {
  shale: { dtc: [101, 6], vpVs: [1.96, 0.07], rhob: [2.51, 0.05] },
  sand: { dtc: [86, 6], vpVs: [1.72, 0.05], rhob: [2.29, 0.06] },
  limestone: { dtc: [56, 3], vpVs: [1.87, 0.04], rhob: [2.66, 0.03] },
};
const LITHOLOGIES: Lithology[] = ["shale", "shale", "sand", "limestone"];

/** Cumulative shares of samples with a defect: 0.4 % without DTS, 0.2 % RHOB null, 0.3 % mispicked shear, 0.1 % swapped curves. */
const DTS_MISSING = 0.004;
const RHOB_NULL = 0.006;
const MISPICKED_SHEAR = 0.009;
const SWAPPED_CURVES = 0.01;

/** The linear congruential generator of Numerical Recipes (ch. 7.1): ample for benchmark noise. */
const lcg = (seed: number) => () => (seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0) / 2 ** 32;

const rounded = (value: number, decimals: number) => Math.round(value * 10 ** decimals) / 10 ** decimals;

export const syntheticWell = (samples: number, seed = 7): SyntheticWell => {
  const random = lcg(seed);
  const noise = () => random() + random() - 1;
  const well: SyntheticWell = {
    depthMetres: new Float64Array(samples),
    dtcMicrosecondsPerFoot: new Float64Array(samples),
    dtsMicrosecondsPerFoot: new Float64Array(samples),
    rhobGramsPerCubicCentimetre: new Float64Array(samples),
  };
  let rock = ROCK.shale;
  let bedEnds = 0;
  for (let i = 0; i < samples; i++) {
    if (i === bedEnds) {
      rock = ROCK[LITHOLOGIES[Math.floor(random() * LITHOLOGIES.length)]];
      bedEnds = i + 20 + Math.floor(random() * 400);
    }
    const dtc = rock.dtc[0] + rock.dtc[1] * noise();
    let dts = dtc * (rock.vpVs[0] + rock.vpVs[1] * noise());
    let rhob = rounded(rock.rhob[0] + rock.rhob[1] * noise(), 3);
    const defect = random();
    if (defect < DTS_MISSING) dts = NaN;
    else if (defect < RHOB_NULL) rhob = NULL_VALUE;
    else if (defect < MISPICKED_SHEAR) dts = dtc * 1.3;
    else if (defect < SWAPPED_CURVES) dts = dtc * 0.92;
    well.depthMetres[i] = rounded(TOP_METRES + i * STEP_METRES, 4);
    well.dtcMicrosecondsPerFoot[i] = rounded(dtc, 2);
    well.dtsMicrosecondsPerFoot[i] = rounded(dts, 2);
    well.rhobGramsPerCubicCentimetre[i] = rhob;
  }
  return well;
};

const columnsOf = (well: SyntheticWell) => [well.depthMetres, well.dtcMicrosecondsPerFoot, well.dtsMicrosecondsPerFoot, well.rhobGramsPerCubicCentimetre];

/** The well as CSV with the header DEPT[m],DTC[us/ft],DTS[us/ft],RHOB[g/cm3]; a NaN is an empty cell. */
export const syntheticWellCsv = (well: SyntheticWell): Iterable<string> =>
  writeCsv({
    curves: [
      { name: "DEPT", unit: "m" },
      { name: "DTC", unit: "us/ft" },
      { name: "DTS", unit: "us/ft" },
      { name: "RHOB", unit: "g/cm3" },
    ],
    columns: columnsOf(well),
  });

/** The well as LAS 2.0; a NaN is written as the null value. */
export const syntheticWellLas = (well: SyntheticWell): Iterable<string> => {
  const [depth, dtc, dts, rhob] = columnsOf(well);
  return writeLas({
    curves: [
      { mnemonic: "DEPT", unit: "M", description: "MEASURED DEPTH", values: depth },
      { mnemonic: "DTC", unit: "US/F", description: "COMPRESSIONAL SLOWNESS", values: dtc },
      { mnemonic: "DTS", unit: "US/F", description: "SHEAR SLOWNESS", values: dts },
      { mnemonic: "RHOB", unit: "G/C3", description: "BULK DENSITY", values: rhob },
    ],
    nullValue: NULL_VALUE,
    wellItems: [
      { mnemonic: "WELL", value: "MARRAM BANK 7" },
      { mnemonic: "COMP", value: "SALTINGS OFFSHORE (FICTIONAL)" },
      { mnemonic: "FLD", value: "MARRAM BANK" },
    ],
    otherLines: ["Synthetic well of our own for the elastilog benchmark: every name and number here is fictional."],
  });
};

/** Writes text chunks to an open file descriptor one by one, so a five-million-sample file never sits in memory. */
export const writeChunks = (fd: number, chunks: Iterable<string>): void => {
  for (const chunk of chunks) writeSync(fd, chunk);
};

/** The core request the service makes of this well with its default options (slownesses in µs/ft, moduli in GPa). */
export const syntheticWellRequest = (well: SyntheticWell): ElasticLogRequest => ({
  compressional: { measure: "slowness", unit: "us/ft", values: well.dtcMicrosecondsPerFoot },
  shear: { measure: "slowness", unit: "us/ft", values: well.dtsMicrosecondsPerFoot },
  density: { unit: "g/cm3", values: well.rhobGramsPerCubicCentimetre },
  nullValue: NULL_VALUE,
  keepNegativePoisson: false,
  limits: withDefaultLimits(),
  modulusUnit: "GPa",
  velocityUnit: "m/s",
  impedanceUnit: "m/s*g/cm3",
});
