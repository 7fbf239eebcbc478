/** Depths as written for messages: ten significant digits, trailing zeros dropped. */
const readable = (value: number): string => String(Number(value.toPrecision(10)));

const more = (count: number): string => (count > 1 ? ` (and ${count - 1} more place${count > 2 ? "s" : ""})` : "");

/**
 * What is wrong with the order of a depth column, as notes for a reader (a CSV file has no STEP to check against):
 * a depth equal to the one before it (a repeated sample), and a step against the direction the column started in
 * (logs spliced with an overlap: one such step; a section written backwards: each of its steps). Each kind is told once, at its first place (rows counted from 1
 * as data rows), with how many more places have it. Absent depths (NaN) are passed over: the depths on either side
 * are compared. The samples are kept as written; the notes only say what a depth plot would show.
 */
export const depthOrderNotes = (depth: Float64Array): string[] => {
  let previous = NaN;
  let previousRow = 0;
  let direction = 0;
  let repeats = 0;
  let firstRepeat = "";
  let turns = 0;
  let firstTurn = "";
  for (let i = 0; i < depth.length; i++) {
    const value = depth[i];
    if (Number.isNaN(value)) continue;
    if (!Number.isNaN(previous)) {
      const change = Math.sign(value - previous);
      if (change === 0) {
        if (repeats++ === 0) firstRepeat = `the depth repeats: data row ${i + 1} has the depth of data row ${previousRow + 1} (${readable(value)})`;
      } else if (direction === 0) direction = change;
      else if (change !== direction && turns++ === 0) {
        firstTurn = `the depth turns back at data row ${i + 1}: from ${readable(previous)} to ${readable(value)}, against the direction the column started in`;
      }
    }
    previous = value;
    previousRow = i;
  }
  return [...(repeats > 0 ? [firstRepeat + more(repeats)] : []), ...(turns > 0 ? [firstTurn + more(turns)] : [])];
};
