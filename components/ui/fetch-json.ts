/** fetch wrapper for the client: JSON in and out, API errors thrown with status, message and details. */

export class ApiError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly details?: unknown,
  ) {
    super(message);
  }
}

/** Fetches JSON; non-2xx answers become ApiError with the server's message. */
export async function fetchJson<T>(url: string, init: RequestInit = {}): Promise<T> {
  const headers = new Headers(init.headers);
  if (init.body && typeof init.body === "string" && !headers.has("content-type")) headers.set("content-type", "application/json");
  const res = await fetch(url, { ...init, headers });
  const text = await res.text();
  let body: unknown;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = null;
  }
  if (!res.ok) {
    const b = body as { error?: string; details?: unknown } | null;
    throw new ApiError(res.status, b?.error ?? `The server answered ${res.status}.`, b?.details);
  }
  return body as T;
}

/** The per-field messages of a 422 answer (`details.fieldErrors`), or none. */
export function fieldErrorsOf(err: unknown): Record<string, string[]> {
  return err instanceof ApiError ? ((err.details as { fieldErrors?: Record<string, string[]> } | undefined)?.fieldErrors ?? {}) : {};
}
