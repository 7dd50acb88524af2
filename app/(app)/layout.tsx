/** Signed-in shell: header with navigation and the user's role; signed-out visitors go to sign-in. */
import Link from "next/link";
import { requirePageUser } from "@/lib/auth/session";
import { roleLabels } from "@/lib/roles";
import { Mark } from "@/components/ui/mark";

export const dynamic = "force-dynamic";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  const links: [string, string][] = [
    ["/projects", "Projects"],
    ["/dashboard", "Dashboard"],
    ["/help/format", "Exchange format"],
    ["/help/api", "API"],
    ["/settings", "Settings"],
    ...(user.role === "admin" ? ([["/admin", "Admin"]] as [string, string][]) : []),
  ];
  return (
    <div className="min-h-screen">
      <header className="no-print border-b border-paper-line bg-paper-deep/60">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3 sm:px-6">
          <Link href="/projects" className="flex items-center gap-2 text-graphite no-underline hover:no-underline">
            <Mark size={24} />
            <span className="font-semibold tracking-tight">Sixfold</span>
          </Link>
          <nav className="hidden gap-4 text-sm md:flex" aria-label="Main">
            {links.map(([href, label]) => (
              <Link key={href} href={href}>
                {label}
              </Link>
            ))}
          </nav>
          <div className="ml-auto flex items-center gap-3 text-sm">
            <span data-testid="whoami">
              {user.name} · <span className="text-graphite-soft">{roleLabels[user.role]}</span>
            </span>
            <Link href="/signout" className="btn-quiet hidden md:inline-flex">
              Sign out
            </Link>
            {/* phones: the same links in a menu */}
            <details className="relative md:hidden" data-testid="phone-menu">
              <summary className="btn-quiet cursor-pointer list-none">Menu</summary>
              <nav className="sheet absolute right-0 z-20 mt-1 flex w-48 flex-col gap-1 p-2 text-sm" aria-label="Main (menu)">
                {links.map(([href, label]) => (
                  <Link key={href} href={href} className="px-2 py-1">
                    {label}
                  </Link>
                ))}
                <Link href="/signout" className="px-2 py-1">
                  Sign out
                </Link>
              </nav>
            </details>
          </div>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-6 sm:px-6 sm:py-8">{children}</main>
    </div>
  );
}
