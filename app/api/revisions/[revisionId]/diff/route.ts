/** GET ?against=ID: what changed from revision `against` to this one (contacts and findings). */
import { z } from "zod";
import { requireUser } from "@/lib/auth/session";
import { handle, idFrom, parseWith } from "@/lib/api/handler";
import { diffRevisions } from "@/lib/db/revisions";

export const dynamic = "force-dynamic";
const querySchema = z.object({ against: z.coerce.number().int().positive() });

export const GET = handle(async (req: Request, ctx: { params: Promise<{ revisionId: string }> }) => {
  const user = await requireUser();
  const id = await idFrom(ctx.params, "revisionId");
  const { against } = parseWith(querySchema, Object.fromEntries(new URL(req.url).searchParams));
  return Response.json({ diff: await diffRevisions(user, against, id) }, { status: 200 });
});
