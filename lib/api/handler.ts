/** Route-handler plumbing: the shared error mapper and zod parsing helpers. */
import "server-only";
import { z } from "zod";
import { AppError, invalid } from "@/lib/errors";

/** Maps an error to a JSON response: known AppErrors keep status and message, anything else is logged and 500. */
export function errorResponse(err: unknown): Response {
  if (err instanceof AppError) {
    return Response.json({ error: err.message, ...(err.details ? { details: err.details } : {}) }, { status: err.status });
  }
  console.error("[api] unexpected error", err);
  return Response.json({ error: "Something went wrong on the server. Nothing was changed." }, { status: 500 });
}

/** Wraps a handler body so thrown errors become proper responses. */
export function handle<A extends unknown[]>(fn: (...args: A) => Promise<Response>) {
  return async (...args: A): Promise<Response> => {
    try {
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
