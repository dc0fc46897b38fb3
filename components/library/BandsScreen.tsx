"use client";
// My bands, from the local book, and a form to start a new band (which needs the network).
import Link from "next/link";
import { useRouter, useSearchParams } from "next/navigation";
import { useEffect, useState, type FormEvent } from "react";
import { z } from "zod";
import { Button, LinkButton } from "@/components/ui/Button";
import { Field, SelectField } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { PageColumn, PageTitle } from "@/components/ui/Page";
import { INSTRUMENT_OPTIONS, instrumentLabel, roleLabel } from "@/components/ui/labels";
import { syncNow, useLocalSession, useMyBands } from "@/lib/offline/hooks";
import { BandCreateSchema } from "@/lib/validation/band";
import { can } from "@/lib/band/roles";
import { errorBodyOf, fieldMessages } from "@/lib/api-error";

const CreatedSchema = z.object({ id: z.string() }).or(z.object({ band: z.object({ id: z.string() }) }));

type Errors = Partial<Record<"name" | "city" | "instrument", string>>;

function CreateBand() {
  const router = useRouter();
  const [errors, setErrors] = useState<Errors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    setFailure(null);
    const form = new FormData(e.currentTarget);
    const city = String(form.get("city") ?? "").trim();
    const parsed = BandCreateSchema.safeParse({ name: form.get("name"), city: city || null, instrument: form.get("instrument") });
    if (!parsed.success) {
      const next: Errors = {};
      for (const i of parsed.error.issues) next[String(i.path[0]) as keyof Errors] ??= i.message;
      setErrors(next);
      return;
    }
    setErrors({});
    setBusy(true);
    try {
      const res = await fetch("/api/bands", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(parsed.data) });
      const json: unknown = await res.json().catch(() => null);
      if (!res.ok) {
        const error = errorBodyOf(json);
        setErrors(fieldMessages(error));
        setFailure(error?.message ?? "The band could not be created. Try again.");
        return;
      }
      const created = CreatedSchema.parse(json);
      const id = "id" in created ? created.id : created.band.id;
      await syncNow().catch(() => undefined);
      router.push(`/bands/${encodeURIComponent(id)}`);
    } catch {
      setFailure("Starting a band needs a connection. Try again when you have signal.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby="new-band-heading" className="rounded-lg border border-paper-dim bg-white p-5">
      <h2 id="new-band-heading" className="text-lg font-semibold">
        Start a band
      </h2>
      <p className="text-sm text-ink-muted">You will lead it: keep the book and invite the players.</p>
      <form onSubmit={submit} noValidate className="mt-4 grid gap-4 sm:grid-cols-2" data-testid="create-band-form">
        <div aria-live="assertive" className="sm:col-span-2">
          {failure ? <Notice kind="error">{failure}</Notice> : null}
        </div>
        <Field label="Band name" name="name" required maxLength={120} error={errors.name} data-testid="band-name" />
        <Field label="City (optional)" name="city" maxLength={120} error={errors.city} data-testid="band-city" />
        <SelectField label="The part you read" name="instrument" defaultValue="concert" options={INSTRUMENT_OPTIONS} error={errors.instrument} className="sm:col-span-2" />
        <div className="sm:col-span-2">
          <Button type="submit" disabled={busy} data-testid="create-band">
            {busy ? "Starting…" : "Start the band"}
          </Button>
        </div>
      </form>
    </section>
  );
}

export function BandsScreen() {
  const session = useLocalSession();
  const bands = useMyBands();
  const router = useRouter();
  const all = useSearchParams().get("all") === "1";
  // A player, arranger or sub in one band goes straight to its library; starting a band is a leader's
  // errand, and `?all=1` (the header's "Your bands") still shows this page.
  const only = bands?.length === 1 && !can(bands[0]!.role, "manageBand") && !all ? bands[0]! : null;
  useEffect(() => {
    if (only) router.replace(`/bands/${encodeURIComponent(only.id)}`);
  }, [only, router]);
  if (only) return <PageColumn><p className="text-ink-muted" role="status">Opening {only.name}…</p></PageColumn>;

  if (session === null) {
    return (
      <PageColumn>
        <PageTitle>Your bands</PageTitle>
        <Notice title="You are signed out">
          <LinkButton href="/signin?callbackUrl=%2Fbands" className="mt-3">
            Sign in
          </LinkButton>
        </Notice>
      </PageColumn>
    );
  }

  return (
    <PageColumn>
      <PageTitle lead={session ? `Signed in as ${session.name}` : undefined}>Your bands</PageTitle>
      {bands === undefined ? (
        <p className="text-ink-muted">Opening your bands…</p>
      ) : bands.length === 0 ? (
        <Notice title="No bands yet">Start one below, or open the invite link a leader sent you.</Notice>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2" data-testid="band-list">
          {bands.map((b) => (
            <li key={b.id}>
              <Link
                href={`/bands/${encodeURIComponent(b.id)}`}
                className="flex min-h-11 flex-col rounded-lg border border-paper-dim bg-white p-4 shadow-sm hover:border-brass"
                data-testid="band-link"
              >
                <span className="text-lg font-semibold">{b.name}</span>
                <span className="text-sm text-ink-muted">
                  {roleLabel(b.role)} · reads {instrumentLabel(b.instrument)}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
      <div className="mt-8">
        <CreateBand />
      </div>
    </PageColumn>
  );
}
