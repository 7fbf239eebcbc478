/** The core kernel alone beside its memory-bandwidth floor, in the benchmark's own process. */
import { computeElasticLog } from "../core/index.js";
import { median, perSecond, yesOrNo, type Row } from "./report.js";
import { syntheticWellRequest, type SyntheticWell } from "./synthetic-well.js";

/**
 * Float64 columns `computeElasticLog` allocates and fills for a GPa answer: Vp, Vs and ρ in SI, the eleven properties,
 * E in Pa for the correlations, and Vp, Vs and ρ in the answer's units (18); the flags (Uint32) besides.
 */
const FLOAT64_COLUMNS = 18;
const WARM_UP_RUNS = 3;
const TARGET = 0.5;

/**
 * The floor: allocate the same arrays and write every element once from an input column, in a plain
 * loop as the kernel does; no arithmetic, no branches.
 */
const copyColumns = (inputs: readonly Float64Array[]): { columns: Float64Array[]; flags: Uint32Array } => {
  const n = inputs[0].length;
  const columns: Float64Array[] = [];
  for (let c = 0; c < FLOAT64_COLUMNS; c++) {
    const source = inputs[c % inputs.length];
    const target = new Float64Array(n);
    for (let i = 0; i < n; i++) target[i] = source[i];
    columns.push(target);
  }
  const flags = new Uint32Array(n);
  for (let i = 0; i < n; i++) flags[i] = i & 1;
  return { columns, flags };
};

/** Holds the last results, so that no work can be skipped as unused. */
export let retained: unknown;

export const kernelCase = (well: SyntheticWell, runs: number): Row[] => {
  const samples = well.depthMetres.length;
  const request = syntheticWellRequest(well);
  const inputs = [well.dtcMicrosecondsPerFoot, well.dtsMicrosecondsPerFoot, well.rhobGramsPerCubicCentimetre];
  const kernelMs: number[] = [];
  const copyMs: number[] = [];
  // Interleaved, so that a busy neighbour on the machine slows both alike.
  for (let run = 0; run < WARM_UP_RUNS + runs; run++) {
    const k0 = performance.now();
    retained = computeElasticLog(request);
    const k1 = performance.now();
    retained = copyColumns(inputs);
    const c1 = performance.now();
    if (run >= WARM_UP_RUNS) {
      kernelMs.push(k1 - k0);
      copyMs.push(c1 - k1);
    }
  }
  const kernelRate = samples / (median(kernelMs) / 1000);
  const copyRate = samples / (median(copyMs) / 1000);
  const share = kernelRate / copyRate;
  return [
    {
      case: `Core kernel alone (computeElasticLog, DTC/DTS/RHOB → GPa), ${samples.toLocaleString("en")} samples, warmed up (median of ${runs})`,
      measured: perSecond(kernelRate, "samples"),
      floor: `${perSecond(copyRate, "samples")} (allocate and fill the same ${FLOAT64_COLUMNS} Float64Arrays and the Uint32 flags in plain loops)`,
      ratio: share.toFixed(2),
      target: `≥ ${TARGET} of the copy rate`,
      met: yesOrNo(share >= TARGET),
    },
  ];
};
