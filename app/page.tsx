import type { Metadata } from "next";
import Image from "next/image";
import { redirect } from "next/navigation";
import { LinkButton } from "@/components/ui/Button";
import { getActor } from "@/lib/server/session";

export const metadata: Metadata = { title: "Pedalpoint — the band's book on every stand" };

const POINTS = [
  {
    title: "One book for the whole band",
    text: "The leader keeps the charts right; a fix made at soundcheck reaches every phone and tablet before the downbeat.",
  },
  {
    title: "Every player in their own key",
    text: "Concert, B♭, E♭, F or bass clef — each chart is written once in concert pitch and read in the key of your horn.",
  },
  {
    title: "Count it off your way",
    text: "Pick the key for the singer, the tempo and how the tune starts: a vamp, a turnaround, the last eight, or the written intro.",
  },
  {
    title: "No signal, no problem",
    text: "The book lives on each device. In a basement club with no bars, tonight's tunes still open and pages still turn.",
  },
] as const;

export default async function Landing() {
  const actor = await getActor();
  if (actor) redirect("/bands");
  return (
    <main id="main" className="mx-auto flex w-full max-w-4xl flex-col gap-10 px-4 py-10 sm:px-6 sm:py-16">
      <header className="flex flex-col gap-6 sm:flex-row sm:items-center">
        <Image src="/icons/pedalpoint.svg" alt="" width={88} height={88} priority className="rounded-2xl" />
        <div>
          <h1 className="text-4xl font-bold tracking-tight text-ink sm:text-5xl">Pedalpoint</h1>
          <p className="mt-2 max-w-2xl text-lg text-ink-soft">
            The band&rsquo;s book of lead sheets and chord charts — kept by the leader, read by every player and sub, in
            their own key, on the stand, with or without signal.
          </p>
        </div>
      </header>

      <div className="flex flex-wrap gap-3">
        <LinkButton href="/signup" data-testid="landing-signup">
          Create an account
        </LinkButton>
        <LinkButton href="/signin" tone="secondary" data-testid="landing-signin">
          Sign in
        </LinkButton>
      </div>

      <section aria-labelledby="what-heading">
        <h2 id="what-heading" className="text-xl font-semibold text-ink">
          What it does for a working band
        </h2>
        <ul className="mt-4 grid gap-4 sm:grid-cols-2">
          {POINTS.map((p) => (
            <li key={p.title} className="rounded-lg border border-paper-dim bg-white p-5 shadow-sm">
              <h3 className="font-semibold text-brass-dark">{p.title}</h3>
              <p className="mt-1 text-ink-soft">{p.text}</p>
            </li>
          ))}
        </ul>
      </section>

      <footer className="border-t border-paper-dim pt-6 text-sm text-ink-muted">
        <p>
          Share only charts you wrote or have the right to share. Arrangements and published tunes are often protected;
          check the licence and the rules where you live and play.
        </p>
      </footer>
    </main>
  );
}
