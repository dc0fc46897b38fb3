import { go, readFailure } from "./redirect";

/** Accepts an invite for the signed-in user and opens the band; returns an error message on failure. */
export async function acceptInviteAndGo(token: string, bandId?: string): Promise<string | null> {
  const q = bandId ? `?bandId=${encodeURIComponent(bandId)}` : "";
  const res = await fetch(`/api/invites/${encodeURIComponent(token)}/accept${q}`, { method: "POST" });
  if (!res.ok) return (await readFailure(res)).message;
  const data = (await res.json()) as { bandId: string };
  go(`/bands/${encodeURIComponent(data.bandId)}?joined=1`);
  return null;
}
