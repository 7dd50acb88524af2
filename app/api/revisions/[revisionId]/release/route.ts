/** POST {action: "request" | "withdraw"} (designer) or {action: "approve"} (checker): release of a revision. */
import { z } from "zod";
import { requireRole } from "@/lib/auth/session";
import { handle, idFrom, jsonBody, parseWith } from "@/lib/api/handler";
import { withdrawRelease } from "@/lib/db/releases";
import { approveAndRelease, askForRelease } from "@/lib/review/actions";
import { forbidden } from "@/lib/errors";
import { allowed } from "@/lib/policy";

export const dynamic = "force-dynamic";
const bodySchema = z.object({ action: z.enum(["request", "withdraw", "approve"]) });

export const POST = handle(async (req: Request, ctx: { params: Promise<{ revisionId: string }> }) => {
  const user = await requireRole(["designer", "checker"]);
  const id = await idFrom(ctx.params, "revisionId");
  const { action } = parseWith(bodySchema, await jsonBody(req));
  if (action === "request") {
    if (!allowed(user.role, "requestRelease")) throw forbidden("Only designers request a release.");
    await askForRelease(user, id);
    return Response.json({ ok: true, status: "requested" }, { status: 201 });
  }
  if (action === "withdraw") {
    if (!allowed(user.role, "withdrawRelease")) throw forbidden("Only designers withdraw a release request.");
    await withdrawRelease(user, id);
    return Response.json({ ok: true, status: "withdrawn" }, { status: 200 });
  }
  if (!allowed(user.role, "approveRelease")) throw forbidden("Only checkers approve a release.");
  await approveAndRelease(user, id);
  return Response.json({ ok: true, status: "released" }, { status: 200 });
});
