/** Printable papers for the page: plain download links (the routes check who may have each), hidden on paper. */
export function DocumentLinks({
  links,
  className = "",
}: {
  links: { href: string; label: string }[];
  className?: string;
}) {
  if (!links.length) return null;
  return (
    <nav
      aria-label="Printable documents"
      className={`flex flex-wrap items-center gap-2 text-sm print:hidden ${className}`}
    >
      <span className="text-flash-600">Print:</span>
      {links.map((l) => (
        <a key={l.href} href={l.href} download className="btn-quiet" data-testid="document-link">
          {l.label}
        </a>
      ))}
    </nav>
  );
}
