export type ClassValue = string | number | false | null | undefined | Record<string, boolean | null | undefined>;

/** Joins class names, dropping falsy entries; a record adds each key whose value is true. */
export function cn(...values: ClassValue[]): string {
  const out: string[] = [];
  for (const value of values) {
    if (value === false || value === null || value === undefined || value === '') continue;
    if (typeof value === 'object') {
      for (const [name, on] of Object.entries(value)) if (on) out.push(name);
    } else {
      out.push(String(value));
    }
  }
  return out.join(' ');
}
