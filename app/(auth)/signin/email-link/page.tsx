import type { Metadata } from "next";
import { LinkRequestForm } from "../../_forms/LinkRequestForm";

export const metadata: Metadata = { title: "Sign in by e-mail" };
export const dynamic = "force-dynamic";

export default async function EmailLinkPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const callbackUrl = typeof sp.callbackUrl === "string" ? sp.callbackUrl : null;
  const mailPage = Boolean(process.env.MAIL_FAKE_HTTP_PORT || process.env.MAIL_FAKE);
  return (
    <>
      <h1 className="mb-2 text-2xl font-bold tracking-tight text-ink">Sign in by e-mail</h1>
      <p className="mb-6 text-ink-muted">We send you a link that signs you in once. No password needed.</p>
      <LinkRequestForm callbackUrl={callbackUrl} mailPage={mailPage} />
    </>
  );
}
