/** One row of an imported rate trace: a breakpoint of a piecewise-linear envelope. */
export interface TracePoint {
  /** Seconds from the start of the trace. */
  t: number;
  /** Rate in Hz at that time. */
  hz: number;
}
