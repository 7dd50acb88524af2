/** Row → DTO helpers shared by the lib/db mappers. */

/** A database timestamp as an ISO string. */
export const iso = (v: unknown): string => new Date(v as string).toISOString();

/** A nullable database timestamp as an ISO string or null. */
export const isoOrNull = (v: unknown): string | null => (v ? iso(v) : null);
