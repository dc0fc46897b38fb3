import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { mailBoxAccess } from "@/lib/server/dev-mail";
import { getActor } from "@/lib/server/session";

export const metadata: Metadata = { title: "Captured mail", robots: { index: false } };
export const dynamic = "force-dynamic";

interface Captured {
  id: number;
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
  links: string[];
}

// Only while the local mail fake runs (demo, dev, tests); a production start has no such page.
// Sign-in and invite links are keys to accounts, so an anonymous caller sees none: a signed-in
// person sees the mail sent to them, and the whole box needs the key printed when the app starts.
export default async function CapturedMailPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const port = process.env.MAIL_FAKE_HTTP_PORT ?? (process.env.MAIL_FAKE === "1" ? "2526" : null);
  if (!port) notFound();
  const sp = await searchParams;
  const access = mailBoxAccess(typeof sp.key === "string" ? sp.key : null, await getActor());
  if (access.kind === "none") {
    return (
      <main id="main" className="mx-auto w-full max-w-3xl px-4 py-8 sm:px-6">
        <h1 className="text-2xl font-bold tracking-tight text-ink">Captured mail</h1>
        <p className="mt-3 text-ink-soft" data-testid="mail-locked">
          Mail caught by the demo holds sign-in links, so it is not shown to everyone. Open the captured-mail address printed in the
          terminal when Pedalpoint started (it carries a key), or{" "}
          <Link className="font-semibold text-brass-dark underline" href="/signin?callbackUrl=%2Fdev%2Fmail">
            sign in
          </Link>{" "}
          to see the mail sent to you.
        </p>
      </main>
    );
  }
  let messages: Captured[] = [];
  let problem: string | null = null;
  try {
    const only = access.kind === "own" ? `?to=${encodeURIComponent(access.email)}` : "";
    const res = await fetch(`http://127.0.0.1:${port}/messages${only}`, { cache: "no-store" });
    messages = ((await res.json()) as { messages: Captured[] }).messages;
  } catch {
    problem = `The mail fake is not answering on port ${port}.`;
  }
  return (
    <main id="main" className="mx-auto w-full max-w-3xl px-4 py-8 sm:px-6">
      <h1 className="text-2xl font-bold tracking-tight text-ink">Captured mail</h1>
      <p className="mt-1 text-ink-muted">
        Demo only: mail the app sends is caught here instead of being delivered. Newest first.{" "}
        {access.kind === "own" ? `Only mail to ${access.email} is shown.` : "Every captured message is shown."}
      </p>
      {problem ? <p role="alert" className="mt-6 font-semibold text-red-800">{problem}</p> : null}
      {!problem && messages.length === 0 ? <p className="mt-6">No mail yet.</p> : null}
      <ol className="mt-6 flex flex-col gap-4" data-testid="mail-list">
        {messages.map((m) => (
          <li key={m.id} className="rounded-lg border border-paper-dim bg-white p-4 shadow-sm" data-testid="mail-item">
            <h2 className="font-semibold text-ink">{m.subject}</h2>
            <p className="text-sm text-ink-muted">
              To {m.to.join(", ")} · <time dateTime={m.receivedAt}>{m.receivedAt.replace("T", " ").slice(0, 19)} UTC</time>
            </p>
            <pre className="mt-3 whitespace-pre-wrap break-words font-sans text-sm text-ink">{m.text}</pre>
            {m.links.length ? (
              <ul className="mt-3 flex flex-col gap-1">
                {m.links.map((l) => (
                  <li key={l}>
                    <a className="break-all font-semibold text-brass-dark underline" href={l}>
                      {l}
                    </a>
                  </li>
                ))}
              </ul>
            ) : null}
          </li>
        ))}
      </ol>
    </main>
  );
}
