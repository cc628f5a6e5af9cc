/** Joins class names, skipping the falsy ones (conditional classes without a dependency). */
export function cx(...parts: Array<string | false | null | undefined>): string {
  return parts.filter(Boolean).join(' ');
}
