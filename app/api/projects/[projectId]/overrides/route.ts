/** GET: a project's rule overrides in force, their history and the rule catalogue (every role). POST (admin): set or clear one. */
import { requireRole, requireUser } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { changeOverride, listOverrides, overrideInputSchema, ruleCatalogue } from "@/lib/db/overrides";
import { can } from "@/lib/policy";

export const dynamic = "force-dynamic";

export const GET = handle(async (_req: Request, ctx: { params: Promise<{ projectId: string }> }) => {
  const user = await requireUser();
  const id = await idFrom(ctx.params, "projectId");
  return Response.json({ ...(await listOverrides(user, id)), rules: ruleCatalogue() }, { status: 200 });
});

export const POST = handle(async (req: Request, ctx: { params: Promise<{ projectId: string }> }) => {
  const user = await requireRole(can.overrideRules);
  const id = await idFrom(ctx.params, "projectId");
  const input = parseWith(overrideInputSchema, await jsonBody(req));
  return Response.json({ override: await changeOverride(user, id, input) }, { status: 201 });
});
