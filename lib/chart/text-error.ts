// The error a chart text reports: where (line, column) and what, in a musician's words.
export class ChartTextError extends Error {
  constructor(
    /** 1-based line of the problem. */
    readonly line: number,
    /** 1-based column of the problem. */
    readonly column: number,
    message: string,
  ) {
    super(message);
    this.name = "ChartTextError";
  }
  /** "Line 4, column 12: …" for a status line or a log. */
  get where(): string {
    return `Line ${this.line}, column ${this.column}: ${this.message}`;
  }
}
