"use client";
// Following a gig: the server-sent event stream of tunes the leader calls (EventSource reconnects by
// itself and resumes from Last-Event-ID). Without a connection the device keeps reading where it is.
import { useCallback, useEffect, useState } from "react";
import { readApiError } from "@/lib/api-error";

export interface Jump {
  seq: number;
  index: number;
}

export interface GigFollow {
  following: boolean;
  setFollowing: (on: boolean) => void;
  canCall: boolean;
  callerId: string | null;
  /** The last call this device jumped to; a new one remounts the bandstand view at that tune. */
  jump: Jump | null;
  call: (index: number) => Promise<void>;
  handTo: (userId: string | null) => Promise<void>;
  error: string | null;
}

interface CallEvent {
  seq: number;
  entryId: string;
}

export function useGigFollow(bandId: string | null, setlistId: string | null, entryIds: readonly string[]): GigFollow {
  const [following, setFollowing] = useState(false);
  const [canCall, setCanCall] = useState(false);
  const [callerId, setCallerId] = useState<string | null>(null);
  const [jump, setJump] = useState<Jump | null>(null);
  const [error, setError] = useState<string | null>(null);
  const base = bandId && setlistId ? `/api/bands/${encodeURIComponent(bandId)}/setlists/${encodeURIComponent(setlistId)}` : null;
  const key = entryIds.join(",");

  useEffect(() => {
    if (!base) return;
    let gone = false;
    fetch(`${base}/calls`, { credentials: "same-origin", cache: "no-store" })
      .then((r) => (r.ok ? (r.json() as Promise<{ canCall: boolean; callerId: string | null }>) : null))
      .then((s) => {
        if (s && !gone) {
          setCanCall(s.canCall);
          setCallerId(s.callerId);
        }
      })
      .catch(() => undefined); // offline: no calling, reading goes on
    return () => {
      gone = true;
    };
  }, [base]);

  useEffect(() => {
    if (!base || !following || typeof EventSource === "undefined") return;
    const ids = key.split(",");
    const source = new EventSource(`${base}/calls/stream`);
    source.addEventListener("call", (e) => {
      const c = JSON.parse((e as MessageEvent<string>).data) as CallEvent;
      const index = ids.indexOf(c.entryId);
      if (index >= 0) setJump((j) => (j && j.seq >= c.seq ? j : { seq: c.seq, index }));
    });
    return () => source.close();
  }, [base, following, key]);

  const call = useCallback(
    async (index: number) => {
      const entryId = entryIds[index];
      if (!base || !entryId) return;
      setError(null);
      try {
        const res = await fetch(`${base}/calls`, { method: "POST", credentials: "same-origin", headers: { "content-type": "application/json" }, body: JSON.stringify({ entryId }) });
        if (!res.ok) throw new Error((await readApiError(res, "The call did not go through.")).message);
        const { call: made } = (await res.json()) as { call: CallEvent };
        setJump({ seq: made.seq, index });
      } catch (e) {
        setError(e instanceof TypeError ? "No connection: the call did not go out." : (e as Error).message);
      }
    },
    [base, entryIds],
  );

  const handTo = useCallback(
    async (userId: string | null) => {
      if (!base) return;
      const res = await fetch(`${base}/caller`, { method: "PUT", credentials: "same-origin", headers: { "content-type": "application/json" }, body: JSON.stringify({ userId }) }).catch(() => null);
      if (res?.ok) setCallerId(userId);
      else setError("Could not hand calling over (no connection?).");
    },
    [base],
  );

  return { following, setFollowing, canCall, callerId, jump, call, handTo, error };
}
