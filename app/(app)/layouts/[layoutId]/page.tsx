/** A layout: revisions, summary, findings table, upload, diff, release. */
import type { Metadata } from "next";
import { requirePageUser } from "@/lib/auth/session";
import { allowed } from "@/lib/policy";
import { LayoutView } from "@/components/layouts/layout-view";

export const metadata: Metadata = { title: "Layout" };

export default async function LayoutPage({ params, searchParams }: { params: Promise<{ layoutId: string }>; searchParams: Promise<{ revision?: string }> }) {
  const { layoutId } = await params;
  const { revision } = await searchParams;
  const user = await requirePageUser(`/layouts/${layoutId}`);
  return (
    <LayoutView
      layoutId={Number(layoutId)}
      initialRevision={revision ? Number(revision) : null}
      can={{
        upload: allowed(user.role, "uploadRevision"),
        requestRelease: allowed(user.role, "requestRelease"),
        approveRelease: allowed(user.role, "approveRelease"),
      }}
    />
  );
}
