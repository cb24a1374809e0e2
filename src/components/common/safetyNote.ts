/** README §Safety: shown wherever results are shown (building page, stack editor, calculation sheets). */
export { SAFETY_NOTE } from '@shared/safety.ts';
