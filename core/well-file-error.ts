/** A well file (LAS or CSV) that cannot be read as given; names the line where one applies. */
export class WellFileError extends Error {
  constructor(
    /** Short stable code, e.g. `las_no_ascii_section`, `csv_ragged_row`. */
    readonly code: string,
    message: string,
    /** 1-based line of the file where the problem is, when there is one. */
    readonly line?: number,
  ) {
    super(line === undefined ? message : `line ${line}: ${message}`);
    this.name = "WellFileError";
  }
}

export const isWellFileError = (error: unknown): error is WellFileError => error instanceof WellFileError;
