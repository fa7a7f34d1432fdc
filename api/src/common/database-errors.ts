import { QueryFailedError } from 'typeorm';

/** PostgreSQL SQLSTATE of a failed query, when it is one. */
export function postgresErrorCode(error: unknown): string | undefined {
  if (error instanceof QueryFailedError) return (error.driverError as { code?: string } | undefined)?.code;
  return undefined;
}

export const UNIQUE_VIOLATION = '23505';
export const FOREIGN_KEY_VIOLATION = '23503';
