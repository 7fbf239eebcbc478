/** One thing wrong with a request's data, named precisely enough to fix it. */
export interface InputIssue {
  /** The field, in the request's own words (`vp`, `zones[2].top`, …). */
  field: string;
  /** Row of a column, when the issue is one element. */
  index?: number;
  message: string;
}

/** Thrown by core when the data cannot be used as given; carries every issue found (up to a cap). */
export class InputIssues extends Error {
  constructor(readonly issues: InputIssue[]) {
    super(issues.map((i) => `${i.field}${i.index === undefined ? "" : `[${i.index}]`}: ${i.message}`).join("; "));
    this.name = "InputIssues";
  }
}

export const isInputIssues = (error: unknown): error is InputIssues => error instanceof InputIssues;

/** At most this many issues are listed; a request with more is described by the first ones. */
export const MAX_LISTED_ISSUES = 20;
