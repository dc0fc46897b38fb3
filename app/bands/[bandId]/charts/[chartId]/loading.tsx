export default function Loading() {
  return (
    <p className="p-6 text-ink-muted" role="status">
      Opening the chart…
    </p>
  );
}
