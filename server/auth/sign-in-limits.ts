// Sign-in limits a team can live with. Only FAILED attempts count, twice:
// - per account (the e-mail as typed, lower-cased, whether or not it exists, so
//   the lock reveals nothing): after `accountLimit` failures in the window the
//   account is locked, says so, and unlocks by itself when the window has passed;
// - per address: a ceiling high enough for a whole team behind one office NAT,
//   low enough to stop one machine guessing at many accounts.
// A successful sign-in counts for nothing and clears its account's failures.
// The address is req.ip, which follows a forwarded header only when TRUST_PROXY
// says so (app.ts); by default the caller cannot choose it.
// Counters live in this process's memory (common practice for a single server;
// several servers behind a balancer each keep their own).
import { HttpProblem } from '../http/problem';

export interface SignInLimitSettings {
  windowMs: number;
  /** Failed attempts per account before it is locked for the rest of the window. */
  accountLimit: number;
  /** Failed attempts per address in the window. */
  addressLimit: number;
}

interface Counter {
  /** Times of failures still inside the window, oldest first. */
  failures: number[];
}

export class SignInLimiter {
  private accounts = new Map<string, Counter>();
  private addresses = new Map<string, Counter>();

  constructor(
    readonly settings: SignInLimitSettings,
    private readonly now: () => number = Date.now,
  ) {}

  private recent(map: Map<string, Counter>, key: string): number[] {
    const c = map.get(key);
    if (!c) return [];
    const since = this.now() - this.settings.windowMs;
    while (c.failures.length > 0 && c.failures[0] <= since) c.failures.shift();
    if (c.failures.length === 0) map.delete(key);
    return c.failures;
  }

  private sweep() {
    // Keep memory bounded: drop counters whose failures have all aged out.
    if (this.accounts.size + this.addresses.size < 10_000) return;
    for (const k of [...this.accounts.keys()]) this.recent(this.accounts, k);
    for (const k of [...this.addresses.keys()]) this.recent(this.addresses, k);
  }

  /** Throws a 429 problem when this account or this address may not try now. */
  check(email: string, address: string): void {
    const account = this.recent(this.accounts, accountKey(email));
    if (account.length >= this.settings.accountLimit) {
      const until = new Date(account[0] + this.settings.windowMs);
      const minutes = Math.max(1, Math.ceil((until.getTime() - this.now()) / 60_000));
      throw new HttpProblem(
        429,
        'Account locked',
        `This account is locked after ${this.settings.accountLimit} failed sign-ins. It unlocks by itself in ${minutes} minute${minutes === 1 ? '' : 's'} (at ${until.toISOString().slice(11, 16)} UTC); other accounts are not affected.`,
        { retryAfterSeconds: Math.ceil((until.getTime() - this.now()) / 1000) },
      );
    }
    const fromAddress = this.recent(this.addresses, address);
    if (fromAddress.length >= this.settings.addressLimit) {
      const waitS = Math.ceil((fromAddress[0] + this.settings.windowMs - this.now()) / 1000);
      const minutes = Math.max(1, Math.ceil(waitS / 60));
      throw new HttpProblem(
        429,
        'Too many sign-in attempts',
        `Too many failed sign-ins from this address (${this.settings.addressLimit} in ${Math.round(this.settings.windowMs / 60_000)} minutes). Wait ${minutes} minute${minutes === 1 ? '' : 's'} and try again.`,
        { retryAfterSeconds: waitS },
      );
    }
  }

  failed(email: string, address: string): void {
    this.sweep();
    const t = this.now();
    for (const [map, key] of [[this.accounts, accountKey(email)], [this.addresses, address]] as const) {
      const c = map.get(key) ?? { failures: [] };
      c.failures.push(t);
      map.set(key, c);
    }
  }

  succeeded(email: string): void {
    this.accounts.delete(accountKey(email));
  }
}

function accountKey(email: string): string {
  return email.trim().toLowerCase();
}
