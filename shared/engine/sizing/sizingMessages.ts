// What the preview says about a lift that has no proposal, in the engineer's words.
import type { SizingRequest } from '../../schema/sizing.ts';

export function formatUtilisationLimit(target: number): string {
  return target.toFixed(2);
}

export function liftMessage(kind: 'none' | 'blocked', request: SizingRequest): string {
  if (kind === 'blocked')
    return 'Not sized: a lift above has no passing section, so the load on this lift is not known';
  const rules = [
    request.allowed ? 'from the allowed list' : '',
    request.noUpwardIncrease ? 'no lighter than the lift above' : '',
    request.sameSerialSize ? 'in one serial size' : '',
  ]
    .filter(Boolean)
    .join(', ');
  return `No section passes: no ${request.series} section in ${request.grade}${rules ? ` (${rules})` : ''} has a utilisation at or below ${formatUtilisationLimit(request.target)}`;
}
