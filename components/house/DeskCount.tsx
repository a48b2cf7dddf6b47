import Link from "next/link";

/** One count on the house desk: a figure, what it counts, and the queue it opens. */
export function DeskCount({
  href,
  count,
  label,
  note,
  alert = false,
  testId,
}: {
  href: string;
  count: number | string;
  label: string;
  note?: React.ReactNode;
  /** Red for a hard problem (reconciliation differences); always with words too. */
  alert?: boolean;
  testId?: string;
}) {
  return (
    <Link
      href={href}
      data-testid={testId}
      className={`card block h-full hover:border-glow-400 ${alert ? "border-fault-600" : ""}`}
    >
      <span className={`code block text-3xl font-semibold ${alert ? "text-fault-700" : "text-flash-900"}`}>
        {count}
      </span>
      <span className="mt-1 block font-medium text-flash-900">{label}</span>
      {note ? <span className="mt-1 block text-xs text-flash-600">{note}</span> : null}
    </Link>
  );
}
