import Link from "next/link";

export type DeskAction = { href: string; title: string; text: string };

/** A role's home: who you are here and the work you can start from it. */
export function DeskHome({
  title,
  intro,
  actions,
  children,
}: {
  title: string;
  intro: string;
  actions: DeskAction[];
  children?: React.ReactNode;
}) {
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-2xl font-semibold tracking-tight">{title}</h1>
        <p className="max-w-3xl text-flash-700">{intro}</p>
      </header>
      {children}
      <ul className="grid gap-4 md:grid-cols-2 lg:grid-cols-3">
        {actions.map((a) => (
          <li key={a.href}>
            <Link href={a.href} className="card block h-full hover:border-glow-400">
              <span className="font-semibold text-flash-900">{a.title}</span>
              <span className="mt-1 block text-sm text-flash-700">{a.text}</span>
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}
