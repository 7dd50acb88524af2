/** Route-handler plumbing: the shared error mapper and zod parsing helpers. */
import "server-only";
import { z } from "zod";
import { AppError, invalid } from "@/lib/errors";

/** True for errors that mean the database cannot be reached (down, restarting, connection lost). */
export function isDatabaseUnreachable(err: unknown): boolean {
  const e = err as { code?: string; errno?: number; fatal?: boolean };
  return (
    /^(ECONNREFUSED|ECONNRESET|ETIMEDOUT|EPIPE|PROTOCOL_CONNECTION_LOST|ER_SERVER_SHUTDOWN|ER_CON_COUNT_ERROR)$/.test(e?.code ?? "") ||
    e?.errno === 2006 ||
    e?.errno === 2013 ||
    /Knex: Timeout acquiring a connection|socket has been ended/.test(String(err))
  );
}

/** Maps an error to a JSON response: known AppErrors keep status and message, anything else is logged and 500. */
export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    // located errors of a refused file sit at the top level (`errors`) in every answer, as in a 422 refusal
    const located = (err.details as { errors?: unknown } | undefined)?.errors;
    return Response.json(
      { error: err.message, ...(err.details ? { details: err.details } : {}), ...(Array.isArray(located) ? { errors: located } : {}) },
      { status: err.status },
    );
  }
  if (isDatabaseUnreachable(err)) {
    const code = (err as { code?: string }).code ?? "";
    console.error("[api] database unreachable", code || String(err));
    return Response.json({ error: "The database is not reachable right now. Nothing was stored; try again in a moment." }, { status: 503 });
  }
  console.error("[api] unexpected error", err);
  return Response.json({ error: "Something went wrong on the server. Nothing was changed." }, { status: 500 });
}

/**
 * CSRF guard for cookie-authenticated mutations: a state-changing request must come from our own origin
 * (Origin, or else Referer, naming the same host). Bearer-token requests carry no cookie and are exempt.
 */
export function checkSameOrigin(req: Request): void {
  if (["GET", "HEAD", "OPTIONS"].includes(req.method)) return;
  if (/^bearer\s+/i.test(req.headers.get("authorization") ?? "")) return;
  const host = req.headers.get("x-forwarded-host") ?? req.headers.get("host");
  const source = req.headers.get("origin") ?? req.headers.get("referer");
  let sourceHost: string | null;
  try {
    sourceHost = source ? new URL(source).host : null;
  } catch {
    sourceHost = null;
  }
  if (!host || !sourceHost || sourceHost !== host) throw new AppError(403, "This request did not come from a Sixfold page (cross-site requests are refused).");
}

/** Wraps a handler body so thrown errors become proper responses; mutations pass the same-origin check first. */
export function handle<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
      if (args[0] instanceof Request) checkSameOrigin(args[0]);
      return await fn(...args);
    } catch (err) {
      return errorResponse(err);
    }
  };
}

/** Parses a value with a zod schema or throws 422 with field errors. */
export function parseWith<S extends z.ZodType>(schema: S, value: unknown): z.infer<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    const flat = z.flattenError(result.error);
    throw invalid("Some fields need attention.", { fieldErrors: flat.fieldErrors, formErrors: flat.formErrors });
  }
  return result.data;
}

/**
 * Reads a request body of at most `limit` bytes. A body declared larger (Content-Length) is refused before it
 * is read; one sent without a length (chunked) is read only until it passes the limit, then the stream is
 * cancelled and 413 thrown, so an endless upload never sits in memory.
 */
export async function readBodyLimited(req: Request, limit: number): Promise<Uint8Array<ArrayBuffer>> {
  const tooLarge = () =>
    new AppError(413, `The file is larger than the ${Math.round(limit / 1048576)} MB limit. Nothing was stored.`, {
      errors: [{ location: "file", message: `larger than ${Math.round(limit / 1048576)} MB` }],
    });
  if (Number(req.headers.get("content-length") ?? 0) > limit) throw tooLarge();
  if (!req.body) return new Uint8Array(0);
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge();
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let at = 0;
  for (const c of chunks) {
    out.set(c, at);
    at += c.byteLength;
  }
  return out;
}

/** Reads a JSON request body or throws 422. */
export async function jsonBody(req: Request): Promise<unknown> {
  try {
    return await req.json();
  } catch {
    throw invalid("The request body is not valid JSON.");
  }
}

const idSchema = z.coerce.number({ error: "must be a number" }).int().positive().max(2147483647);

/** Reads a numeric id from route params, or throws 404 (an unparseable id names nothing). */
export async function idFrom(params: Promise<Record<string, string>>, key: string): Promise<number> {
  const raw = (await params)[key];
  const parsed = idSchema.safeParse(raw);
  if (!parsed.success) throw new AppError(404, "Nothing was found at that address.");
  return parsed.data;
}
