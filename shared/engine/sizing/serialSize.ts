// The serial size of a catalogue section: the nominal depth and width that a splice cover plate is
// made to, so that keeping it across a splice keeps the splice simple (common practice, no source).

/**
 * "UKC 254x254x89" → "UKC 254x254", "SHS 200x200x10" → "SHS 200x200", "CHS 219.1x8.0" → "CHS 219.1",
 * "HE 300 B" → "HE 300" (HE A, B and M of one nominal size), "IPE 300" → "IPE 300".
 */
export function serialSize(designation: string): string {
  const he = /^HE (\d+) [ABM]$/.exec(designation);
  if (he) return `HE ${he[1]}`;
  if (/^IPE \d+$/.test(designation)) return designation;
  return designation.replace(/x[\d.]+$/, '');
}
