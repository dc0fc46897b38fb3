"use client";
// The gig controls in the bandstand bar: follow the leader's calls; for the caller, call a tune; the
// set's tunes with a mark on those changed since this device last read them.
import { useState } from "react";
import { BarLabel } from "@/components/bandstand/BarLabel";
import type { LocalMember } from "@/lib/offline/types";
import type { GigFollow } from "./useGigFollow";
import { can } from "@/lib/band/roles";

export interface GigTune {
  title: string;
  changed: boolean;
}

interface Props {
  gig: GigFollow;
  tunes: GigTune[];
  /** The tune this device is on. */
  at: number;
  isLeader: boolean;
  members?: LocalMember[];
}

export function GigBar({ gig, tunes, at, isLeader, members }: Props) {
  const [open, setOpen] = useState(false);
  return (
    <>
      {gig.canCall && at + 1 < tunes.length ? (
        <button type="button" className="pp-bar-button" onClick={() => void gig.call(at + 1)} aria-label="Call next" data-testid="call-next">
          <BarLabel long="Call next" short="⇥" />
        </button>
      ) : null}
      {!gig.canCall ? (
        <button type="button" className="pp-bar-button" aria-pressed={gig.following} onClick={() => gig.setFollowing(!gig.following)} aria-label={gig.following ? "Following" : "Follow"} data-testid="follow-toggle">
          <BarLabel long={gig.following ? "Following" : "Follow"} short="⇣" />
        </button>
      ) : null}
      <button type="button" className="pp-bar-button" aria-expanded={open} aria-controls="pp-gig-tunes" onClick={() => setOpen(!open)} aria-label="Tunes" data-testid="tune-list-toggle">
        <BarLabel long="Tunes" short="☰" />
      </button>
      {gig.error ? (
        <span role="alert" className="pp-bar-next">
          {gig.error}
        </span>
      ) : null}
      {open ? (
        <div id="pp-gig-tunes" className="fixed bottom-12 right-2 z-20 max-h-[70vh] w-72 overflow-auto rounded-md border border-white/30 bg-black/95 p-2 text-white" data-testid="tune-list">
          <ol className="flex flex-col gap-1">
            {tunes.map((t, i) => (
              <li key={i} data-testid="tune-list-item" data-changed={t.changed ? "true" : undefined} aria-current={i === at ? "true" : undefined} className="flex items-center justify-between gap-2">
                <span className={i === at ? "font-bold" : undefined}>
                  {i + 1}. {t.title}
                  {t.changed ? <span className="ml-1 text-amber-300"> · changed since you read it</span> : null}
                </span>
                {gig.canCall ? (
                  <button type="button" className="rounded border border-white/40 px-2 py-0.5 text-sm" onClick={() => void gig.call(i)} data-testid="call-tune" aria-label={`Call ${t.title}`}>
                    Call
                  </button>
                ) : null}
              </li>
            ))}
          </ol>
          {isLeader && members?.length ? (
            <label className="mt-3 block text-sm">
              Who calls the tunes
              <select className="mt-1 block w-full rounded bg-black text-white" value={gig.callerId ?? ""} onChange={(e) => void gig.handTo(e.target.value || null)} data-testid="hand-calling">
                <option value="">Me (the leader)</option>
                {members
                  .filter((m) => !can(m.role, "callTunes"))
                  .map((m) => (
                    <option key={m.userId} value={m.userId}>
                      {m.name}
                    </option>
                  ))}
              </select>
            </label>
          ) : null}
        </div>
      ) : null}
    </>
  );
}
