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

/**
 * The addresses an invoice was issued with (copies: a later change of address does not alter them), and the house as
 * sender, in the settings version frozen for the sale.
 */
export function InvoiceAddresses({
  house,
  buyer,
  origin,
}: {
  house: AddressBlock | null;
  buyer: AddressBlock | null;
  origin: AddressBlock | null;
}) {
  const blocks = [
    house ? <Block key="from" title="From" block={house} testId="invoice-from" /> : null,
    buyer ? <Block key="to" title="Ship to" block={buyer} testId="invoice-ship-to" /> : null,
    origin ? <Block key="origin" title="Ships from" block={origin} testId="invoice-ships-from" /> : null,
  ].filter(Boolean);
  if (!blocks.length) return null;
  return (
    <section
      aria-label="Addresses"
      className={`card grid gap-4 text-sm sm:grid-cols-2 ${blocks.length > 2 ? "max-w-3xl lg:grid-cols-3" : "max-w-lg"}`}
    >
      {blocks}
    </section>
  );
}
