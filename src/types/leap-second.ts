/**
 * RFC 3339 §5.7 allows a seconds value of 60 only for a leap second, which UTC inserts as 23:59:60;
 * with a local offset that moment is written in local time (RFC 3339 §5.8: 1990-12-31T15:59:60-08:00).
 * We accept :60 when the UTC time of day is 23:59, without consulting the table of leap seconds.
 */
export function leapSecondAllowed(hour: number, minute: number, offsetMinutes: number): boolean {
  return (((hour * 60 + minute - offsetMinutes) % 1440) + 1440) % 1440 === 1439;
}
