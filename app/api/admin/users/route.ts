/** GET: every account with its state; POST: add an account. Administrators only. */
import { requireRole } from "@/lib/auth/session";
import { handle, jsonBody, parseWith } from "@/lib/api/handler";
import { addUser, listAllUsers, newUserSchema } from "@/lib/db/users";
import { listAudit } from "@/lib/db/audit";

export const dynamic = "force-dynamic";

export const GET = handle(async () => {
  const user = await requireRole(["admin"]);
  return Response.json({ users: await listAllUsers(user), history: await listAudit("user") }, { status: 200 });
});

export const POST = handle(async (req: Request) => {
  const user = await requireRole(["admin"]);
  const input = parseWith(newUserSchema, await jsonBody(req));
  return Response.json({ user: await addUser(user, input) }, { status: 201 });
});
