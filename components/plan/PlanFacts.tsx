// The plan's facts as a list a screen reader reads in order.
export interface PlanView {
  plan: "free" | "band";
  label: string;
  status: string;
  currentPeriodEnd: string | null;
  cancelAtPeriodEnd: boolean;
  limits: { charts: number | null; members: number | null };
  usage: { charts: number; members: number };
  price?: { amount: number; currency: string; interval: string } | null;
}

/** "€9.00 a month", in the reader's own number format. */
export function priceInWords(price: NonNullable<PlanView["price"]>): string {
  const money = new Intl.NumberFormat(undefined, { style: "currency", currency: price.currency.toUpperCase() }).format(price.amount / 100);
  return `${money} a ${price.interval}`;
}

const STATUS_WORDS: Record<string, string> = {
  active: "Active",
  trialing: "Trial",
  past_due: "Payment overdue: the plan stays on while the payment is retried",
  canceled: "Cancelled",
  incomplete: "Waiting for payment",
};

function day(iso: string): string {
  return new Date(iso).toLocaleDateString(undefined, { year: "numeric", month: "long", day: "numeric" });
}

function Usage({ label, used, limit, testId }: { label: string; used: number; limit: number | null; testId: string }) {
  return (
    <div>
      <dt className="text-sm text-ink-muted">{label}</dt>
      <dd className="font-semibold" data-testid={testId}>
        {limit === null ? `${used} (no limit)` : `${used} of ${limit}`}
      </dd>
      {limit !== null ? <meter className="mt-1 block w-full" min={0} max={limit} value={Math.min(used, limit)} aria-label={`${label}: ${used} of ${limit}`} /> : null}
    </div>
  );
}

export function PlanFacts({ plan }: { plan: PlanView }) {
  return (
    <dl className="grid gap-4 rounded-lg border border-ink-soft bg-white p-4 sm:grid-cols-2" data-testid="plan-facts" data-plan={plan.plan}>
      <div>
        <dt className="text-sm text-ink-muted">Plan</dt>
        <dd className="text-xl font-bold" data-testid="plan-name">{plan.label}</dd>
      </div>
      <div>
        <dt className="text-sm text-ink-muted">Status</dt>
        <dd className="font-semibold" data-testid="plan-status">
          {plan.cancelAtPeriodEnd ? "Cancelled, runs until the renewal date" : (STATUS_WORDS[plan.status] ?? plan.status)}
        </dd>
      </div>
      {plan.currentPeriodEnd ? (
        <div>
          <dt className="text-sm text-ink-muted">{plan.cancelAtPeriodEnd ? "Band plan ends on" : "Renews on"}</dt>
          <dd className="font-semibold" data-testid="plan-renewal">{day(plan.currentPeriodEnd)}</dd>
        </div>
      ) : null}
      <Usage label="Charts in the book" used={plan.usage.charts} limit={plan.limits.charts} testId="plan-charts" />
      <Usage label="Members and open invites" used={plan.usage.members} limit={plan.limits.members} testId="plan-members" />
    </dl>
  );
}
