/** The printable release report of a revision: the drawing views (the same SVG as on screen) and the report text. */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { getRevision, latestRevisionId } from "@/lib/db/revisions";
import { currentReportMarkdown } from "@/lib/report/release";
import { LayoutDrawings } from "@/components/layout-views/layout-drawings";
import { MarkdownView } from "@/components/markdown/markdown-view";
import { PrintButton } from "@/components/ui/print-button";
import { notFound } from "next/navigation";

export const metadata: Metadata = { title: "Printable report" };
export const dynamic = "force-dynamic";

export default async function PrintPage({ params, searchParams }: { params: Promise<{ layoutId: string }>; searchParams: Promise<{ revision?: string }> }) {
  const { layoutId } = await params;
  const { revision } = await searchParams;
  const user = await requirePageUser(`/layouts/${layoutId}/print`);
  const id = Number(revision) || (await latestRevisionId(Number(layoutId) || 0));
  if (!id) notFound();
  const rev = await getRevision(user, id).catch(() => null);
  if (!rev || rev.layoutId !== Number(layoutId)) notFound();
  const md = await currentReportMarkdown(user, id);
  const [title, ...rest] = md.split("\n");
  return (
    <article className="mx-auto max-w-4xl space-y-4 bg-white p-6 print:p-0" data-testid="printable-report">
      <div className="no-print flex justify-end">
        <PrintButton />
      </div>
      <MarkdownView source={title} className="text-lg" />
      <LayoutDrawings layout={rev.layout} report={rev.report} print />
      <MarkdownView source={rest.join("\n")} />
    </article>
  );
}
