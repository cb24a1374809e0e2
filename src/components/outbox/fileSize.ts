// Attachment sizes as people read them, in the binary prefixes of IEC 80000-13 (1 KiB = 1024 B).

const UNITS = ['KiB', 'MiB', 'GiB'] as const;

/** "512 B", "1.5 KiB", "2.0 MiB": one decimal above a kibibyte, whole bytes below. */
export function formatFileSize(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  let value = bytes / 1024;
  let unit = 0;
  while (value >= 1024 && unit < UNITS.length - 1) {
    value /= 1024;
    unit += 1;
  }
  return `${value.toFixed(1)} ${UNITS[unit]}`;
}
