/** PATCH {role?, active?}: change an account's role or (de)activate it. Administrators only. */
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { changeUser, userChangeSchema } from "@/lib/db/users";

export const dynamic = "force-dynamic";

export const PATCH = handle(async (req: Request, ctx: { params: Promise<{ userId: string }> }) => {
  const user = await requireRole(["admin"]);
  const id = await idFrom(ctx.params, "userId");
  const change = parseWith(userChangeSchema, await jsonBody(req));
  return Response.json({ user: await changeUser(user, id, change) }, { status: 200 });
});
