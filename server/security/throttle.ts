import { createHash } from 'node:crypto';
import type pg from 'pg';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { HttpError } from '../errors';

/** At most `points` attempts in a window of `durationS` seconds. */
export interface LimitRule {
  points: number;
  durationS: number;
}

/** One limit per account (an e-mail, a member, an invitation) and one per client address. */
export interface ThrottleRules {
  perAccount: LimitRule;
  perAddress: LimitRule;
}

export interface Throttle {
  /**
   * Counts one attempt against `address`, then `account`, and throws a 429 with
   * Retry-After when either is over its limit. Counting comes before the work,
   * so a burst of parallel guesses cannot slip in before the first one is counted.
   */
  attempt(account: string, address: string): Promise<void>;
  /** Forgets the account's count after a success, so an owner's own sign-ins never add up to a lock. */
  succeeded(account: string): Promise<void>;
}

/** The table every limiter shares (db/schema/rateLimits.ts); keys carry each limiter's name. */
export const RATE_LIMIT_TABLE = 'rate_limits';

// Keys are hashed: e-mail addresses stay out of the table, and every key fits its 255 characters.
const keyOf = (value: string) => createHash('sha256').update(value).digest('base64url').slice(0, 32);

function limiter(pool: pg.Pool, keyPrefix: string, rule: LimitRule) {
  return new RateLimiterPostgres({
    storeClient: pool,
    storeType: 'pool',
    tableName: RATE_LIMIT_TABLE,
    tableCreated: true,
    keyPrefix,
    points: rule.points,
    duration: rule.durationS,
  });
}

const tooMany = (msBeforeNext: number) => {
  const seconds = Math.max(1, Math.ceil(msBeforeNext / 1000));
  const wait = seconds >= 120 ? `${Math.ceil(seconds / 60)} minutes` : `${seconds} seconds`;
  return new HttpError(429, 'too_many_attempts', `Too many attempts. Wait ${wait} and try again.`, undefined, undefined, seconds);
};

/** Counts one point on `key`; a limiter's refusal becomes a 429, a store failure is passed on (503). */
async function consumeOr429(limiter: RateLimiterPostgres, key: string): Promise<void> {
  try {
    await limiter.consume(key);
  } catch (err) {
    if (err instanceof RateLimiterRes) throw tooMany(err.msBeforeNext);
    throw err;
  }
}

/**
 * A Postgres-backed limiter named `name` (one name per kind of attempt, e.g.
 * "sign-in" or "proof-page"), so several server processes share one count.
 * A store failure (Postgres away) is passed on as it is and becomes a 503.
 */
export function createThrottle(pool: pg.Pool, name: string, rules: ThrottleRules): Throttle {
  const accounts = limiter(pool, `${name}:account`, rules.perAccount);
  const addresses = limiter(pool, `${name}:address`, rules.perAddress);
  return {
    async attempt(account, address) {
      // The address first: a guesser already refused there costs the account nothing,
      // so someone spraying guesses cannot keep every owner locked out.
      await consumeOr429(addresses, keyOf(address));
      await consumeOr429(accounts, keyOf(account));
    },
    async succeeded(account) {
      await accounts.delete(keyOf(account));
    },
  };
}

const minutes = (n: number) => n * 60;

/** What each credential form allows by default; tests and the environment may tighten or loosen them. */
export const defaultThrottleRules = {
  signIn: { perAccount: { points: 10, durationS: minutes(15) }, perAddress: { points: 100, durationS: minutes(15) } },
  signUp: { perAccount: { points: 5, durationS: minutes(60) }, perAddress: { points: 20, durationS: minutes(60) } },
  joinInvitation: { perAccount: { points: 10, durationS: minutes(15) }, perAddress: { points: 30, durationS: minutes(15) } },
  passwordChange: { perAccount: { points: 5, durationS: minutes(15) }, perAddress: { points: 30, durationS: minutes(15) } },
} satisfies Record<string, ThrottleRules>;

export type CredentialAction = keyof typeof defaultThrottleRules;
export type Throttles = Record<CredentialAction, Throttle>;

export interface ThrottleOptions {
  /** Rules to use instead of the defaults, per action. */
  rules?: Partial<Record<CredentialAction, ThrottleRules>>;
  /** Raises every per-address limit to at least this many points (a shared office or test runner behind one address). */
  minPerAddress?: number;
  /** Put before every limiter's name, so tests can keep their counts apart on one database. */
  keyPrefix?: string;
}

/** The limiters of the sign-in, sign-up, join and password-change forms. */
export function createCredentialThrottles(pool: pg.Pool, options: ThrottleOptions = {}): Throttles {
  const build = (action: CredentialAction, name: string) => {
    const rules = options.rules?.[action] ?? defaultThrottleRules[action];
    const perAddress = { ...rules.perAddress, points: Math.max(rules.perAddress.points, options.minPerAddress ?? 0) };
    return createThrottle(pool, `${options.keyPrefix ?? ''}${name}`, { ...rules, perAddress });
  };
  return {
    signIn: build('signIn', 'sign-in'),
    signUp: build('signUp', 'sign-up'),
    joinInvitation: build('joinInvitation', 'join'),
    passwordChange: build('passwordChange', 'password-change'),
  };
}
