import Link from "next/link";

/** A short caution where a hazard applies, linking to the full cautions page. */
export function CautionStrip({ children, anchor }: { children: React.ReactNode; anchor?: string }) {
  return (
    <aside
      role="note"
      className="flex items-start gap-3 rounded-md border border-glow-200 bg-glow-50 px-4 py-3 text-sm text-flash-800"
    >
      <span aria-hidden="true" className="mt-0.5 font-bold text-glow-700">
        !
      </span>
      <p>
        <strong className="font-semibold">Caution: </strong>
        {children}{" "}
        <Link href={`/cautions${anchor ? `#${anchor}` : ""}`} className="underline underline-offset-2">
          Read the cautions
        </Link>
        .
      </p>
    </aside>
  );
}
