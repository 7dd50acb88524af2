/** requireUser / requireRole: the one gate every route handler, server action and page goes through. */
import "server-only";
import { getServerSession } from "next-auth";
import { redirect } from "next/navigation";
import { headers } from "next/headers";
import { authenticateToken } from "@/lib/db/tokens";
import { authOptions } from "./options";
import { forbidden, unauthorized } from "@/lib/errors";
import { findUserById } from "@/lib/db/users";
import type { Role } from "@/lib/roles";

export interface SessionUser {
  id: number;
  name: string;
  email: string;
  role: Role;
}

/** The Authorization header of the current request, or null outside a request. */
async function bearer(): Promise<string | null> {
  try {
    const auth = (await headers()).get("authorization");
    return auth && /^bearer\s+/i.test(auth) ? auth.replace(/^bearer\s+/i, "").trim() : null;
  } catch {
    return null;
  }
}

/**
 * The caller: a bearer API token (CAD scripts) or the signed-in user, re-read from the database so a
 * disabled account or changed role takes effect; null when neither is valid.
 */
export async function currentUser(): Promise<SessionUser | null> {
  const token = await bearer();
  if (token !== null) return authenticateToken(token);
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (!id) return null;
  const user = await findUserById(id);
  return user ? { id: user.id, name: user.name, email: user.email, role: user.role } : null;
}

/** Throws 401 when nobody is signed in; a bearer token that does not authenticate is answered as such. */
export async function requireUser(): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) {
    if ((await bearer()) !== null)
      throw unauthorized("The API token is not valid: it is unknown, revoked, or its account is deactivated. Create a new one under Settings → API tokens.");
    throw unauthorized();
  }
  return user;
}

/** Throws 401 when signed out, 403 when the user's role is not in `allowed`. */
export async function requireRole(allowed: readonly Role[]): Promise<SessionUser> {
  const user = await requireUser();
  if (!allowed.includes(user.role)) throw forbidden();
  return user;
}

/** For pages: redirects signed-out visitors to the sign-in page. */
export async function requirePageUser(callbackUrl = "/projects"): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect(`/signin?callbackUrl=${encodeURIComponent(callbackUrl)}`);
  return user;
}
