import { ipKeyGenerator } from 'express-rate-limit';

export interface LoginLimits {
  /** Failed sign-ins allowed per e-mail address (from any client) within the window. */
  perAddress: number;
  /** Failed sign-ins allowed per client address (over all e-mail addresses) within the window. */
  perClient: number;
  windowMs: number;
}

export type LoginAttempt =
  | { allowed: false; retryAfterSeconds: number }
  | {
      allowed: true;
      /** The password matched: the attempt does not count, and the address's earlier failures are forgiven. */
      succeeded(): void;
      /** The attempt could not be judged (a server error): it does not count. */
      abandoned(): void;
    };

/**
 * Sliding-window limit on FAILED sign-ins, counted twice: per e-mail address (guessing one
 * account's password from many clients) and per client (spraying many addresses from one
 * client). An attempt takes a slot in both counts as it starts, so parallel guesses cannot
 * overtake the limit while bcrypt runs; a successful sign-in gives its slots back, so a team
 * signing in from one office address never locks itself out. A successful sign-in clears the
 * address's failures but never the client's, so signing in to one's own account does not reset
 * a spray. The state lives in this process's memory (one app process per database, see README).
 */
export class LoginLimiter {
  private readonly hits = new Map<string, number[]>();
  private lastSweep = 0;

  constructor(private readonly limits: LoginLimits) {}

  static clientKey(ip: string | undefined): string {
    // IPv6 clients are grouped by their /56 prefix, as express-rate-limit does.
    return `client:${ipKeyGenerator(ip ?? '')}`;
  }

  static addressKey(email: string): string {
    return `address:${email.trim().toLowerCase()}`;
  }

  begin(email: string, ip: string | undefined, now = Date.now()): LoginAttempt {
    this.sweep(now);
    const address = LoginLimiter.addressKey(email);
    const client = LoginLimiter.clientKey(ip);
    const waits = [this.waitMs(address, this.limits.perAddress, now), this.waitMs(client, this.limits.perClient, now)];
    const waitMs = Math.max(...waits);
    if (waitMs > 0) return { allowed: false, retryAfterSeconds: Math.max(1, Math.ceil(waitMs / 1000)) };
    this.push(address, now);
    this.push(client, now);
    return {
      allowed: true,
      succeeded: () => {
        this.hits.delete(address);
        this.remove(client, now);
      },
      abandoned: () => {
        this.remove(address, now);
        this.remove(client, now);
      },
    };
  }

  /** Time until the key is below its limit again: when the oldest hit that keeps it full leaves the window. */
  private waitMs(key: string, limit: number, now: number): number {
    const list = this.live(key, now);
    if (list.length < limit) return 0;
    const oldestThatMatters = list[list.length - limit]!;
    return oldestThatMatters + this.limits.windowMs - now;
  }

  private live(key: string, now: number): number[] {
    const list = this.hits.get(key);
    if (!list) return [];
    const from = now - this.limits.windowMs;
    let k = 0;
    while (k < list.length && list[k]! <= from) k++;
    if (k > 0) list.splice(0, k);
    if (list.length === 0) this.hits.delete(key);
    return list;
  }

  private push(key: string, now: number) {
    const list = this.hits.get(key);
    if (list) list.push(now);
    else this.hits.set(key, [now]);
  }

  private remove(key: string, at: number) {
    const list = this.hits.get(key);
    if (!list) return;
    const k = list.lastIndexOf(at);
    if (k >= 0) list.splice(k, 1);
    if (list.length === 0) this.hits.delete(key);
  }

  /** Drops expired keys about once a window, so a spray of addresses does not grow memory for good. */
  private sweep(now: number) {
    if (now - this.lastSweep < this.limits.windowMs) return;
    this.lastSweep = now;
    for (const key of [...this.hits.keys()]) this.live(key, now);
  }
}
