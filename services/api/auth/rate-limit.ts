/**
 * Per-key rate limit: a token bucket per API key, kept in this process's memory. With several instances behind
 * a load balancer each keeps its own buckets, so a key may reach N × the limit in all (docs/api.md says so).
 * Buckets are dropped when full again, so memory stays bounded by the keys active in the last minute.
 */
export interface RateLimitOptions {
  /** Requests per minute per key (also the burst size). */
  perMinute: number;
}

export const DEFAULT_RATE_LIMIT_PER_MINUTE = 1200;

/**
 * Failed authentications allowed per client address per minute (also the burst) before that address is answered
 * 429 without a key lookup: guessing keys costs a database read each, and 3,000 bogus keys were 3,000 reads.
 */
export const DEFAULT_FAILED_AUTH_PER_MINUTE = 30;

interface Bucket {
  tokens: number;
  at: number;
}

export interface RateDecision {
  allowed: boolean;
  limit: number;
  remaining: number;
  /** Seconds until one request is allowed again (when refused). */
  retryAfterSeconds: number;
}

export class RateLimiter {
  private readonly buckets = new Map<string, Bucket>();
  private readonly perMs: number;

  constructor(
    readonly options: RateLimitOptions,
    private readonly now: () => number = () => performance.now(),
  ) {
    this.perMs = options.perMinute / 60_000;
  }

  /** The refusal `take` would give now, without using a token; null while a request would be allowed. */
  refusal(key: string): RateDecision | null {
    const bucket = this.buckets.get(key);
    if (!bucket) return null;
    const tokens = Math.min(this.options.perMinute, bucket.tokens + (this.now() - bucket.at) * this.perMs);
    if (tokens >= 1) return null;
    return { allowed: false, limit: this.options.perMinute, remaining: 0, retryAfterSeconds: Math.max(1, Math.ceil((1 - tokens) / this.perMs / 1000)) };
  }

  take(key: string): RateDecision {
    const now = this.now();
    const capacity = this.options.perMinute;
    const bucket = this.buckets.get(key) ?? { tokens: capacity, at: now };
    bucket.tokens = Math.min(capacity, bucket.tokens + (now - bucket.at) * this.perMs);
    bucket.at = now;
    if (bucket.tokens < 1) {
      this.buckets.set(key, bucket);
      return { allowed: false, limit: capacity, remaining: 0, retryAfterSeconds: Math.max(1, Math.ceil((1 - bucket.tokens) / this.perMs / 1000)) };
    }
    bucket.tokens -= 1;
    this.buckets.set(key, bucket);
    if (this.buckets.size > 10_000) this.sweep(now);
    return { allowed: true, limit: capacity, remaining: Math.floor(bucket.tokens), retryAfterSeconds: 0 };
  }

  private sweep(now: number): void {
    for (const [key, bucket] of this.buckets) {
      if (bucket.tokens + (now - bucket.at) * this.perMs >= this.options.perMinute) this.buckets.delete(key);
    }
  }
}
