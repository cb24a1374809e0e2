import type { Role } from '@shared/schema/api.ts';

export const ROLE_OPTIONS: { label: string; value: Role; description: string }[] = [
  { label: 'Viewer', value: 'viewer', description: 'reads results and issued revisions' },
  { label: 'Engineer', value: 'engineer', description: 'edits stacks and levels' },
  { label: 'Lead', value: 'lead', description: 'also manages members and freezes revisions' },
];
