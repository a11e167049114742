// Times as a person on the farm reads them: in the farm's (or the user's) time zone, with the
// zone named, so an e-mail read elsewhere still says which clock it means. Used by the pages'
// useDisplay() and by the server's e-mails, PDFs and lists.
import { DateTime } from 'luxon';

/** "Fri 12 Mar 2027, 06:30 PDT" */
export function zonedDateTime(iso: string | Date, zone: string): string {
  const at = typeof iso === 'string' ? DateTime.fromISO(iso, { zone }) : DateTime.fromJSDate(iso, { zone });
  return at.isValid ? at.toFormat('ccc d LLL yyyy, HH:mm ZZZZ') : 'Unknown time';
}

/** "Fri 12 Mar 2027, 06:30 to Sat 13 Mar 2027, 09:00 PDT"; the zone once when both ends share it. */
export function zonedRange(from: string | Date, to: string | Date, zone: string): string {
  const start = zonedDateTime(from, zone);
  const end = zonedDateTime(to, zone);
  const zoneOf = (s: string) => s.slice(s.lastIndexOf(' ') + 1);
  return zoneOf(start) === zoneOf(end) ? `${start.slice(0, start.lastIndexOf(' '))} to ${end}` : `${start} to ${end}`;
}
