/** Whether a database error is a unique-constraint violation (SQLite or PostgreSQL). */
export function isUniqueViolation(error: unknown): boolean {
  const e = error as { code?: string; driverError?: { code?: string }; message?: string };
  const code = e?.driverError?.code ?? e?.code;
  return code === 'SQLITE_CONSTRAINT_UNIQUE' || code === 'SQLITE_CONSTRAINT_PRIMARYKEY' || code === '23505' || /UNIQUE constraint failed/.test(e?.message ?? '');
}
