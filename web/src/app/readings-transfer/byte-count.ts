const KB = 1000;
const MB = 1000 * 1000;

/** A byte count for a progress line in the viewer's locale: "820 bytes", "12.4 kB", "3.1 MB" (SI units). */
export function formatByteCount(bytes: number, locale: string): string {
  const format = (value: number, unit: string, digits: number) =>
    new Intl.NumberFormat(locale, {
      style: 'unit',
      unit,
      unitDisplay: unit === 'byte' ? 'long' : 'short',
      maximumFractionDigits: digits,
    }).format(value);
  if (bytes < KB) return format(bytes, 'byte', 0);
  if (bytes < MB) return format(bytes / KB, 'kilobyte', 1);
  return format(bytes / MB, 'megabyte', 1);
}
