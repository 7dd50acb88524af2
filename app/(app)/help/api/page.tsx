/** The token API for CAD export scripts: endpoints, examples and a ready shell snippet. */
import type { Metadata } from "next";
import { readFile } from "node:fs/promises";
import path from "node:path";
import { requirePageUser } from "@/lib/auth/session";
import { MarkdownView } from "@/components/markdown/markdown-view";

export const metadata: Metadata = { title: "API for CAD scripts" };

const doc = (base: string, script: string) => `
Create a token under **Settings → API tokens**. A token acts as you, with your role: designers upload,
every role reads. Send it as \`Authorization: Bearer sfx_…\`.

| method and path | does | answers |
|---|---|---|
| \`POST /api/v1/layouts/{layoutId}/revisions\` | the layout file is the body; \`Content-Type\` picks the encoding (\`application/json\`, \`application/xml\`, \`text/csv\` with \`?length=mm&force=N\`); \`X-File-Name\` names it | **201** with the engine's report (the contract of the analysis page) plus \`revision.url\`; **422** \`{ errors: [{ location, message }] }\` for a refused file (an empty one included); **413** with the same \`errors\` for a body over 5 MB, cut off while it streams when no \`Content-Length\` is sent; **503** when the analysis queue is full or the database is unreachable (nothing stored; retry); 401 without a valid token, 403 for a role that may not upload |
| \`GET /api/v1/layouts/{layoutId}/findings?status=open\` | findings of the newest revision; \`status\` = open, waived, resolved, reopened or all | **200** \`{ revision, findings: [{ id, rule, severity, title, status, contacts, loadCase, body }] }\` |

The layout id is in the address of the layout page (\`/layouts/12\`).

### Fail the CAD export when Sixfold finds errors

Download [sixfold-post.sh](/sixfold-post.sh) and call it from the export step; it exits 1 when the
revision has error findings and 2 when the file is refused:

\`\`\`sh
${script}
\`\`\`

### Examples

\`\`\`sh
curl -H "Authorization: Bearer $SIXFOLD_TOKEN" -H "Content-Type: application/json" \\
     --data-binary @breadboard.json ${base}/api/v1/layouts/1/revisions

curl -H "Authorization: Bearer $SIXFOLD_TOKEN" "${base}/api/v1/layouts/1/findings?status=open"
\`\`\`
`;

export default async function ApiHelpPage() {
  await requirePageUser("/help/api");
  const base = (process.env.NEXTAUTH_URL ?? "http://localhost:3000").replace(/\/$/, "");
  const script = await readFile(path.join(process.cwd(), "public", "sixfold-post.sh"), "utf8");
  return (
    <div className="max-w-4xl space-y-4">
      <h1>API for CAD export scripts</h1>
      <div className="sheet p-4" data-testid="api-doc">
        <MarkdownView source={doc(base, script.trim())} />
      </div>
    </div>
  );
}
