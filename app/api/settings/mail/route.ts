/** GET: the kinds of mail and which the caller muted. PUT {muted: [...]}: set them. */
import { z } from "zod";
import { requireUser } from "@/lib/auth/session";
import { handle, jsonBody, parseWith } from "@/lib/api/handler";
import { mailKinds, mutedKinds, setMutedKinds, type MailKind } from "@/lib/mail/outbox";

export const dynamic = "force-dynamic";
const bodySchema = z.object({ muted: z.array(z.enum(Object.keys(mailKinds) as [MailKind, ...MailKind[]])).max(10) });

export const GET = handle(async () => {
  const user = await requireUser();
  return Response.json({ kinds: mailKinds, muted: await mutedKinds(user.id) }, { status: 200 });
});

export const PUT = handle(async (req: Request) => {
  const user = await requireUser();
  const { muted } = parseWith(bodySchema, await jsonBody(req));
  await setMutedKinds(user.id, muted);
  return Response.json({ muted }, { status: 200 });
});
