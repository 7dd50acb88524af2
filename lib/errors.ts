/** Application errors that carry an HTTP status and a message safe to show a user. */

export class AppError extends Error {
  constructor(
    public readonly status: number,
    message: string,
    public readonly details?: unknown,
  ) {
    super(message);
    this.name = "AppError";
  }
}

/** 401: nobody is signed in. */
export const unauthorized = (msg = "Sign in to continue.") => new AppError(401, msg);
/** 403: signed in, but the role or membership does not allow this. */
export const forbidden = (msg = "Your role does not allow this.") => new AppError(403, msg);
/** 404: the thing does not exist or is not visible to this user. */
export const notFound = (what = "That item") => new AppError(404, `${what} was not found.`);
/** 409: a conflicting change (duplicate name, stale version). */
export const conflict = (msg: string) => new AppError(409, msg);
/** 422: input that fails validation. */
export const invalid = (msg: string, details?: unknown) => new AppError(422, msg, details);
