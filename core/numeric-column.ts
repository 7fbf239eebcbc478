import { InputIssues, MAX_LISTED_ISSUES, type InputIssue } from "./input-issues.js";

/**
 * Reads a column given as an array of numbers and nulls into a Float64Array,
 * with NaN where the array holds null. Any other element is an issue naming its index. A Float64Array
 * (from a binary body) is already a column and is taken as it is.
 */
export const toFloat64Column = (values: readonly unknown[] | Float64Array, field: string): Float64Array => {
  if (values instanceof Float64Array) return values;
  const column = new Float64Array(values.length);
  const issues: InputIssue[] = [];
  for (let i = 0; i < values.length; i++) {
    const value = values[i];
    if (typeof value === "number") column[i] = value;
    else if (value === null) column[i] = NaN;
    else if (issues.length < MAX_LISTED_ISSUES) {
      issues.push({ field, index: i, message: `expected a number or null, got ${describe(value)}` });
    }
  }
  if (issues.length > 0) throw new InputIssues(issues);
  return column;
};

const describe = (value: unknown): string => {
  if (typeof value === "string") return `the string ${JSON.stringify(value.slice(0, 40))}`;
  if (Array.isArray(value)) return "an array";
  return typeof value === "object" ? "an object" : typeof value;
};

/** Checks that all named columns have the same length as the first one. */
export const requireEqualLengths = (columns: Record<string, { length: number } | undefined>): number => {
  const present = Object.entries(columns).filter((entry): entry is [string, { length: number }] => entry[1] !== undefined);
  const [firstName, first] = present[0];
  const issues = present
    .filter(([, column]) => column.length !== first.length)
    .map(([name, column]) => ({
      field: name,
      message: `has ${column.length} values but ${firstName} has ${first.length}; every column must have one value per sample`,
    }));
  if (issues.length > 0) throw new InputIssues(issues);
  return first.length;
};
