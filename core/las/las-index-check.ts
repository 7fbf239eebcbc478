import { firstPlaceTally, readableNumber } from "../place-notes.js";
import type { LasWarning } from "./las-document.js";

/** A number read from a `~Well` item, with the line it is on. */
export interface LasNumberItem {
  value: number | undefined;
  line: number;
}

export interface LasIndexCheck {
  /** Takes the index value of each sample, in file order, with the line where the sample begins; an absent one is passed over. */
  sample(index: number, line: number): void;
  finish(): LasWarning[];
}

/**
 * Compares the index (first curve) with STRT, STOP and STEP of `~Well` (CWLS LAS 2.0, Appendix 1
 * Part 4, ~W: STEP negative when STRT > STOP, zero for a variable step). Mismatches are warnings;
 * the samples are kept as written. An absent index (NaN, or equal to `nullValue`) is no depth: it is passed over,
 * no step is measured across it, and a warning counts such samples.
 */
export const createIndexCheck = (start: LasNumberItem, stop: LasNumberItem, step: LasNumberItem, nullValue?: number): LasIndexCheck => {
  const stepValue = step.value;
  const tolerance = Math.abs(stepValue ?? 0) * 1e-3 || 1e-6;
  const stepMismatch = firstPlaceTally();
  const directionChange = firstPlaceTally();
  const absent = firstPlaceTally();
  let previous: number | undefined;
  let direction = 0;
  let first: { index: number; line: number } | undefined;
  let last: { index: number; line: number } | undefined;

  const sample = (index: number, line: number): void => {
    if (Number.isNaN(index) || index === nullValue) {
      absent.add(line, () => "the index (first curve) of this sample is absent (the null value or NaN)");
      // No step is measured across it.
      previous = undefined;
      return;
    }
    if (first === undefined) first = { index, line };
    last = { index, line };
    if (previous !== undefined) {
      const change = index - previous;
      const from = previous;
      if (stepValue !== undefined && stepValue !== 0) {
        if (Math.abs(change - stepValue) > tolerance) {
          stepMismatch.add(
            line,
            () => `STEP says ${readableNumber(stepValue)} but the index changes by ${readableNumber(change)} (from ${readableNumber(from)} to ${readableNumber(index)})`,
          );
        }
      } else if (direction === 0) {
        direction = Math.sign(change);
      } else if (Math.sign(change) !== direction) {
        directionChange.add(
          line,
          () => `the index does not keep to one direction: it goes from ${readableNumber(from)} to ${readableNumber(index)}`,
        );
      }
    }
    previous = index;
  };

  const headerWarnings = (): LasWarning[] => {
    const warnings: LasWarning[] = [];
    if (first !== undefined && start.value !== undefined && Math.abs(first.index - start.value) > tolerance) {
      warnings.push({
        line: first.line,
        message: `STRT says ${readableNumber(start.value)} (line ${start.line}) but the first sample's index is ${readableNumber(first.index)}`,
      });
    }
    if (last !== undefined && stop.value !== undefined && Math.abs(last.index - stop.value) > tolerance) {
      warnings.push({
        line: last.line,
        message: `STOP says ${readableNumber(stop.value)} (line ${stop.line}) but the last sample's index is ${readableNumber(last.index)}`,
      });
    }
    if (start.value !== undefined && stop.value !== undefined && stepValue !== undefined && stepValue !== 0) {
      if (start.value !== stop.value && Math.sign(stop.value - start.value) !== Math.sign(stepValue)) {
        warnings.push({
          line: step.line,
          message: `STEP ${readableNumber(stepValue)} goes the wrong way from STRT ${readableNumber(start.value)} to STOP ${readableNumber(stop.value)}`,
        });
      }
    }
    return warnings;
  };

  const finish = (): LasWarning[] => [...headerWarnings(), ...absent.notes(), ...stepMismatch.notes(), ...directionChange.notes()];

  return { sample, finish };
};
