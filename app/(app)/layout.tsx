/** Signed-in shell: header with navigation and the user's role; signed-out visitors go to sign-in. */
import Link from "next/link";
import { requirePageUser } from "@/lib/auth/session";
import { roleLabels } from "@/lib/roles";
import { Mark } from "@/components/ui/mark";

export const dynamic = "force-dynamic";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  return (
    <div className="min-h-screen">
      <header className="no-print border-b border-paper-line bg-paper-deep/60">
        <div className="mx-auto flex max-w-6xl items-center gap-6 px-6 py-3">
          <Link href="/projects" className="flex items-center gap-2 text-graphite no-underline hover:no-underline">
            <Mark size={24} />
            <span className="font-semibold tracking-tight">Sixfold</span>
          </Link>
          <nav className="flex gap-4 text-sm">
            <Link href="/projects">Projects</Link>
            <Link href="/dashboard">Dashboard</Link>
            <Link href="/help/format">Exchange format</Link>
            <Link href="/help/api">API</Link>
            <Link href="/settings">Settings</Link>
            {user.role === "admin" && <Link href="/admin">Admin</Link>}
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span data-testid="whoami">
              {user.name} · <span className="text-graphite-soft">{roleLabels[user.role]}</span>
            </span>
            <Link href="/signout" className="btn-quiet">
              Sign out
            </Link>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-6 py-8">{children}</main>
    </div>
  );
}
