// How figures read on screen: elevations to the millimetre with a sign, utilisation to two places,
// dates in ISO 8601.
import type { QTableColumn } from 'quasar';

/** "+3.500" (m): the one formatter shared with the package and the e-mail. */
export { formatElevation } from '@shared/wording.ts';

/** "0.87"; a dash when there is no result. */
export function formatUtilisation(u: number | null): string {
  return u === null ? '—' : u.toFixed(2);
}

/** "2026-03-14 09:05" in UTC, from any date string the API sends. */
export function formatIsoDate(value: string): string {
  const d = new Date(value);
  if (Number.isNaN(d.getTime())) return value;
  return `${d.toISOString().slice(0, 10)} ${d.toISOString().slice(11, 16)}`;
}

/** The "Updated (UTC)" column of a table of things with an ISO `updatedAt` (buildings, stacks). */
export function updatedAtColumn<Row extends { updatedAt: string }>(): QTableColumn<Row> {
  return {
    name: 'updatedAt',
    label: 'Updated (UTC)',
    field: 'updatedAt',
    align: 'left',
    sortable: true,
    format: (v: string) => formatIsoDate(v),
  };
}
