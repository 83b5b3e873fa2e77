/**
 * How many ticks to ask d3 for along `plotWidth` px: about one per `spacing` px, at most
 * `most` (the desktop count), so that tick labels never run into each other on a phone
 * (issue 14 QA: at 390 px the Arrivals chart wrote "100120140160…" in one run).
 */
export function tickCount(plotWidth: number, most = 8, spacing = 60): number {
  return Math.max(2, Math.min(most, Math.floor(plotWidth / spacing)));
}
