"use client";
// The bar across every band screen: where you are, where you can go, and the way out.
import Link from "next/link";
import { usePathname } from "next/navigation";
import { useState } from "react";
import { useBandRoute } from "@/lib/offline/route";
import { signOutAndClear, useMembership, useMyBands } from "@/lib/offline/hooks";
import { cx } from "@/components/ui/cx";
import { can } from "@/lib/band/roles";

interface NavItem {
  href: string;
  label: string;
  testId: string;
  /** Other paths that belong under this item (a chart page belongs to the library). */
  also?: string;
}

/** What the header offers: `manage` = members and plan, `edit` = import. */
function navFor(bandId: string, { manage, edit }: { manage: boolean; edit: boolean }): NavItem[] {
  const base = `/bands/${encodeURIComponent(bandId)}`;
  const items: NavItem[] = [
    { href: base, label: "Library", testId: "nav-library", also: `${base}/charts` },
    { href: `${base}/setlists`, label: "Set lists", testId: "nav-setlists" },
  ];
  if (edit) items.push({ href: `${base}/import`, label: "Import", testId: "nav-import" });
  if (manage) items.push({ href: `${base}/members`, label: "Members", testId: "nav-members" });
  if (manage) items.push({ href: `${base}/plan`, label: "Plan", testId: "nav-plan" });
  items.push({ href: "/settings", label: "Settings", testId: "nav-settings" });
  items.push({ href: "/account", label: "Account", testId: "nav-account" });
  return items;
}

function isCurrent(pathname: string, item: NavItem): boolean {
  const under = (p: string) => pathname === p || pathname.startsWith(`${p}/`);
  if (item.also) return pathname === item.href || under(item.also);
  return under(item.href);
}

/** Reading views (the bandstand, playing a set) use the whole screen: no header, no sync bar. */
export function isStagePath(pathname: string | null): boolean {
  return /\/(bandstand|play)(\/|$)/.test(pathname ?? "");
}

/** The page's first tab stop: straight past the bars to the page's own content. */
export function SkipLink() {
  return (
    <a
      href="#main"
      className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-paper focus:px-3 focus:py-2 focus:text-ink"
      data-testid="skip-link"
    >
      Skip to content
    </a>
  );
}

export function AppHeader() {
  const { bandId } = useBandRoute();
  const pathname = usePathname();
  const bands = useMyBands();
  const membership = useMembership(bandId ?? "");
  const [leaving, setLeaving] = useState(false);
  const band = bandId ? bands?.find((b) => b.id === bandId) : undefined;
  // Reading views (the bandstand, playing a set) use the whole screen.
  const onStage = isStagePath(pathname);
  const items = bandId ? navFor(bandId, { manage: can(membership?.role, "manageMembers"), edit: can(membership?.role, "editCharts") }) : [];

  async function signOut() {
    setLeaving(true);
    try {
      // Clears this device's copy of the book, then leaves for the sign-in page.
      await signOutAndClear();
    } catch (err) {
      console.error(err);
      setLeaving(false);
    }
  }

  if (onStage) return null;
  return (
    <header className="no-print border-b border-ink-soft bg-ink text-paper">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 gap-y-1 px-4 py-2 sm:px-6">
        <Link href="/bands" className="flex min-h-11 items-center gap-2 font-bold tracking-tight text-paper">
          {/* eslint-disable-next-line @next/next/no-img-element */}
          <img src="/icons/pedalpoint.svg" alt="" width={28} height={28} className="rounded-md" />
          <span>Pedalpoint</span>
        </Link>
        {band ? (
          <span className="min-w-0 truncate text-brass-light" data-testid="header-band-name">
            <span className="sr-only">Band: </span>
            {band.name}
          </span>
        ) : null}
        <button
          type="button"
          onClick={signOut}
          disabled={leaving}
          className="ml-auto min-h-11 rounded-md px-3 text-paper underline-offset-4 hover:underline disabled:opacity-60"
          data-testid="sign-out"
        >
          {leaving ? "Signing out…" : "Sign out"}
        </button>
      </div>
      {items.length ? (
        <nav aria-label="Band" className="mx-auto max-w-6xl overflow-x-auto px-2 sm:px-4">
          <ul className="flex gap-1">
            {items.map((item) => {
              const current = isCurrent(pathname, item);
              return (
                <li key={item.href}>
                  <Link
                    href={item.href}
                    data-testid={item.testId}
                    aria-current={current ? "page" : undefined}
                    className={cx(
                      "flex min-h-11 items-center whitespace-nowrap border-b-4 px-3 font-semibold",
                      current ? "border-brass text-paper" : "border-transparent text-paper/80 hover:text-paper",
                    )}
                  >
                    {item.label}
                  </Link>
                </li>
              );
            })}
          </ul>
        </nav>
      ) : null}
    </header>
  );
}
