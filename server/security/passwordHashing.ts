import { hash, verify } from '@node-rs/argon2';
import pLimit from 'p-limit';
import { HttpError } from '../errors';

// OWASP's recommended argon2id settings: 19 MiB, 2 passes, 1 lane.
const hashOptions = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

/** Hashes running at once: each holds 19 MiB and a core for about 50 ms. */
export const ARGON2_CONCURRENCY = 2;
/** Hashes allowed to wait; past this a flood is refused at once instead of queueing memory and time. */
export const ARGON2_MAX_WAITING = 32;

const slots = pLimit(ARGON2_CONCURRENCY);

function bounded<T>(work: () => Promise<T>): Promise<T> {
  if (slots.pendingCount >= ARGON2_MAX_WAITING) {
    return Promise.reject(new HttpError(503, 'busy', 'The server is busy checking passwords; try again in a moment.', undefined, undefined, 2));
  }
  return slots(work);
}

export const hashPassword = (password: string) => bounded(() => hash(password, hashOptions));
export const verifyPassword = (digest: string, password: string) => bounded(() => verify(digest, password, hashOptions));

/** Hashes running and waiting right now, for tests and the benchmark. */
export const hashingLoad = () => ({ active: slots.activeCount, waiting: slots.pendingCount });
