"use client";
// The band's gigs, newest first, from the local book. Leaders and arrangers start a new one here.
import Link from "next/link";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { useBandRoute } from "@/lib/offline/route";
import { useMembership, useSetlistEntryCounts, useSetlists } from "@/lib/offline/hooks";
import { newId } from "@/lib/offline/outbox";
import { gigWhen } from "./datetime";
import { can } from "@/lib/band/roles";

export function SetlistsScreen() {
  const { bandId } = useBandRoute();
  const router = useRouter();
  const setlists = useSetlists(bandId);
  const counts = useSetlistEntryCounts(bandId);
  const membership = useMembership(bandId);
  if (!bandId) return null;
  const base = `/bands/${encodeURIComponent(bandId)}/setlists`;
  const editable = can(membership?.role, "editSetlists");

  // Opens an empty draft; the set list is stored only when the leader saves it there.
  function create() {
    router.push(`${base}/${encodeURIComponent(newId())}?new=1`);
  }

  return (
    <PageColumn>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <PageTitle lead={membership && !can(membership.role, "readAllSetlists") ? "The set lists shared with you." : "Gigs and their sets, on this device for the bandstand."}>Set lists</PageTitle>
        {editable ? (
          <Button onClick={create} data-testid="new-setlist">
            New set list
          </Button>
        ) : null}
      </div>
      {setlists === undefined ? (
        <p className="py-8 text-center text-ink-muted">Opening the set lists…</p>
      ) : setlists.length === 0 ? (
        <Notice title="No set lists yet">
          {editable ? "Start one with “New set list”." : "When the leader makes a set list, it will appear here."}
        </Notice>
      ) : (
        <ul className="flex flex-col gap-2" data-testid="setlists">
          {setlists.map((s) => (
            <li key={s.id}>
              <Link
                href={`${base}/${encodeURIComponent(s.id)}`}
                className="flex min-h-11 flex-wrap items-baseline justify-between gap-2 rounded-md border border-ink-soft bg-white px-4 py-3 hover:border-brass"
                data-testid="setlist-link"
              >
                <span className="font-semibold">{s.name}</span>
                <span className="text-sm text-ink-muted">
                  {[gigWhen(s.startsAt), s.venue, `${counts?.get(s.id) ?? 0} tunes`].filter(Boolean).join(" · ")}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
    </PageColumn>
  );
}
