import { z } from 'zod';
import { HttpError } from '../errors';

const uuid = z.string().uuid();

/** A row id from the path; anything that is not a UUID cannot name a row, so it is a 404. */
export function idParam(value: unknown, what: string): string {
  const parsed = uuid.safeParse(value);
  if (!parsed.success) throw new HttpError(404, 'not_found', `${what} was not found`);
  return parsed.data;
}
