/**
 * Sign-in rate limiting: after 5 failed attempts for one e-mail within 10 minutes, further attempts are
 * refused for 5 minutes. Kept in the server process's memory (one server; a restart clears it).
 */
const WINDOW_MS = 10 * 60 * 1000;
const LOCK_MS = 5 * 60 * 1000;
const MAX_FAILURES = 5;

const failures = new Map<string, { times: number[]; lockedUntil: number }>();

/** Whether sign-in for this key is locked now. */
export function isLocked(key: string, now = Date.now()): boolean {
  const f = failures.get(key);
  return !!f && f.lockedUntil > now;
}

/** Records a failed attempt; returns true when it locks the key. */
export function recordFailure(key: string, now = Date.now()): boolean {
  const f = failures.get(key) ?? { times: [], lockedUntil: 0 };
  f.times = f.times.filter((t) => now - t < WINDOW_MS);
  f.times.push(now);
  if (f.times.length >= MAX_FAILURES) {
    f.lockedUntil = now + LOCK_MS;
    f.times = [];
  }
  failures.set(key, f);
  if (failures.size > 10_000) for (const [k, v] of failures) if (v.lockedUntil < now && !v.times.some((t) => now - t < WINDOW_MS)) failures.delete(k);
  return f.lockedUntil > now;
}

/** Clears the failures after a successful sign-in. */
export function recordSuccess(key: string): void {
  failures.delete(key);
}
