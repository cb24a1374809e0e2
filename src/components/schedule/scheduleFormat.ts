// How the schedule's figures read on screen: tonnes to three places, utilisation to two (as the downloads).
export const tonnes = (kg: number): string => (kg / 1000).toFixed(3);
export const metres = (m: number): string => m.toFixed(3);
export const ratio = (u: number): string => u.toFixed(2);
