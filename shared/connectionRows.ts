// One row per splice (bottom to top) and the base, as the results pane, the package and the downloads word them.
import type { CalcStep, ConnectionStatus, StackResult } from './schema/results.ts';
import { formatElevation } from './engine/stack/formatElevation.ts';

export interface ConnectionRow {
  id: string;
  where: string;
  fit: string;
  NEd: string;
  tension: string;
  resistance: string;
  utilisation: string;
  status: ConnectionStatus;
  statusText: string;
  notes: string[];
  steps: CalcStep[];
}

const kN = (v: number | null): string => (v === null ? '–' : v.toFixed(0));

export function statusText(status: ConnectionStatus): string {
  return status === 'passes' ? 'passes' : status === 'fails' ? 'FAILS' : 'not given';
}

export function connectionRows(result: StackResult | null): ConnectionRow[] {
  if (!result || result.errors.length) return [];
  const rows: ConnectionRow[] = [];
  if (result.base) {
    const b = result.base;
    rows.push({
      id: b.nodeId,
      where: `Base at ${formatElevation(b.elevation)}`,
      fit: b.tension
        ? 'In tension: holding-down bolts to be designed for it'
        : b.tRequired === null
          ? 'Base plate'
          : `Base plate, t ≥ ${b.tRequired.toFixed(1)} mm`,
      NEd: kN(b.NEd),
      tension: b.tension ? kN(-b.NminEd) : '0',
      resistance: kN(b.NjRd),
      utilisation: b.utilisation === null ? '–' : b.utilisation.toFixed(2),
      status: b.status,
      statusText: statusText(b.status),
      notes: b.notes,
      steps: b.steps,
    });
  }
  for (const s of result.splices ?? []) {
    rows.push({
      id: s.nodeId,
      where: `Splice at ${formatElevation(s.elevation)}`,
      fit: s.fit,
      NEd: kN(s.NEd),
      tension: kN(s.tension),
      resistance: kN(s.NtRd),
      utilisation: s.utilisation === null ? '–' : s.utilisation.toFixed(2),
      status: s.status,
      statusText:
        statusText(s.status) + (s.meetsTie === true ? ', meets the tie' : s.meetsTie === false ? ', tie not met' : ''),
      notes: s.notes,
      steps: s.steps,
    });
  }
  return rows;
}
