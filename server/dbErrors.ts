// Recognising the database's own refusals, which read differently on SQLite and PostgreSQL, so that a
// race the database settles becomes a 409 and text it cannot store becomes a 400, never a 500.

function codeOf(err: unknown): string | null {
  if (typeof err !== 'object' || err === null || !('code' in err)) return null;
  const { code } = err as { code: unknown };
  return typeof code === 'string' ? code : null;
}

/** A unique index refused the row (PostgreSQL 23505; better-sqlite3 SQLITE_CONSTRAINT_UNIQUE). */
export function isUniqueViolation(err: unknown): boolean {
  const code = codeOf(err);
  return code === '23505' || code === 'SQLITE_CONSTRAINT_UNIQUE' || code === 'SQLITE_CONSTRAINT_PRIMARYKEY';
}

/** PostgreSQL cannot store the text (a NUL character: 22021; 22P05 in JSON). */
export function isUnstorableText(err: unknown): boolean {
  const code = codeOf(err);
  return code === '22021' || code === '22P05';
}

/** Runs `work`; a unique violation becomes the error `onClash()` makes. */
export async function onUniqueViolation<T>(work: () => Promise<T>, onClash: () => Error): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (isUniqueViolation(err)) throw onClash();
    throw err;
  }
}
