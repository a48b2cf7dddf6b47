import type { AddressBlock } from "@/lib/validation/address";

function Block({ title, block, testId }: { title: string; block: AddressBlock; testId: string }) {
  return (
    <div>
      <h3 className="text-xs font-semibold uppercase tracking-wide text-flash-600">{title}</h3>
      <address data-testid={testId} className="not-italic">
        <span className="font-medium">{block.name}</span>
        {block.lines.map((l, i) => (
          <span key={i} className="block">
            {l}
          </span>
        ))}
      </address>
    </div>
  );
}

/** The addresses an invoice was issued with (copies: a later change of address does not alter them). */
export function InvoiceAddresses({ buyer, origin }: { buyer: AddressBlock | null; origin: AddressBlock | null }) {
  if (!buyer && !origin) return null;
  return (
    <section aria-label="Addresses" className="card grid max-w-lg gap-4 text-sm sm:grid-cols-2">
      {buyer ? <Block title="Ship to" block={buyer} testId="invoice-ship-to" /> : null}
      {origin ? <Block title="Ships from" block={origin} testId="invoice-ships-from" /> : null}
    </section>
  );
}
