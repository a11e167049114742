// A tstzrange column as Sequelize's RANGE(DATE) reads and writes it: two bounds, each a
// Date (null when open) and whether it is included.
export type TimeRangeBound = { value: Date | null; inclusive: boolean };
export type TimeRange = [TimeRangeBound, TimeRangeBound];

/** A half-open range [from, to); a missing end leaves that side open. */
export function timeRange(from: Date | string | null, to: Date | string | null): TimeRange {
  return [
    { value: from == null ? null : new Date(from), inclusive: true },
    { value: to == null ? null : new Date(to), inclusive: false },
  ];
}

/** The bounds as ISO strings (null when open or empty), the shape the API answers with. */
export function rangeBounds(range: TimeRange | [] | null | undefined): { from: string | null; to: string | null } | null {
  if (!range || range.length !== 2) return null;
  const at = (bound: TimeRangeBound) => (bound.value == null || !Number.isFinite(new Date(bound.value).getTime()) ? null : new Date(bound.value).toISOString());
  return { from: at(range[0]), to: at(range[1]) };
}
