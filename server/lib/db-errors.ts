/** Recognises MariaDB errors by their error number (mysql2 puts it in `errno`). */

/** ER_DUP_ENTRY: a unique index refused the row. */
export function isDuplicateKeyError(e: unknown): boolean {
  return typeof e === 'object' && e !== null && (e as { errno?: unknown }).errno === 1062;
}
