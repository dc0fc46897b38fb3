import { LinkButton } from "@/components/ui/Button";
import { PageColumn } from "@/components/ui/Page";

export default function NotFound() {
  return (
    <PageColumn>
      <h1 className="text-2xl font-bold text-ink">Not on the stand</h1>
      <p className="mt-2 text-ink-muted">
        We could not find that page. It may have been moved, or it belongs to a band you are not in.
      </p>
      <div className="mt-6 flex flex-wrap gap-3">
        <LinkButton href="/bands">Your bands</LinkButton>
        <LinkButton href="/" tone="secondary">
          Home
        </LinkButton>
      </div>
    </PageColumn>
  );
}
