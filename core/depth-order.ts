import { firstPlaceTally, readableNumber } from "./place-notes.js";

/**
 * What is wrong with the order of a depth column, as notes for a reader (a CSV file has no STEP to check against):
 * a depth equal to the one before it (a repeated sample), and a step against the direction the column started in
 * (logs spliced with an overlap: one such step; a section written backwards: each of its steps). Each kind is told
 * once, at its first place (rows counted from 1 as data rows), with how many more places have it. Absent depths
 * (NaN) are passed over: the depths on either side are compared. The samples are kept as written; the notes only
 * say what a depth plot would show.
 */
export const depthOrderNotes = (depth: Float64Array): string[] => {
  const repeats = firstPlaceTally();
  const turns = firstPlaceTally();
  let previous = NaN;
  let previousRow = 0;
  let direction = 0;
  for (let i = 0; i < depth.length; i++) {
    const value = depth[i];
    if (Number.isNaN(value)) continue;
    if (!Number.isNaN(previous)) {
      const change = Math.sign(value - previous);
      const [row, before, from] = [i + 1, previousRow + 1, previous];
      if (change === 0) repeats.add(row, () => `the depth repeats: data row ${row} has the depth of data row ${before} (${readableNumber(value)})`);
      else if (direction === 0) direction = change;
      else if (change !== direction) {
        turns.add(row, () => `the depth turns back at data row ${row}: from ${readableNumber(from)} to ${readableNumber(value)}, against the direction the column started in`);
      }
    }
    previous = value;
    previousRow = i;
  }
  return [...repeats.notes(), ...turns.notes()].map((note) => note.message);
};
