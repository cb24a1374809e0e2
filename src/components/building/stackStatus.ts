import type { StackSummary } from '@shared/schema/api.ts';

type Status = StackSummary['status'];

export const STATUS_LABEL: Record<Status, string> = { passes: 'Passes', fails: 'Fails', errors: 'Has errors' };
export const STATUS_ICON: Record<Status, string> = {
  passes: 'check_circle',
  fails: 'cancel',
  errors: 'report_problem',
};
export const STATUS_COLOUR: Record<Status, string> = { passes: 'positive', fails: 'negative', errors: 'deep-orange-8' };
