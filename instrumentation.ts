/** Server start-up: the mail outbox's retry timer starts once per server process (not as a side effect of a request). */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    const { ensureOutboxTimer } = await import("./lib/mail/outbox");
    ensureOutboxTimer();
  }
}
