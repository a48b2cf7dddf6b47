import Link from "next/link";
import { BASIS_WORDS, CONDITION_WORDS, HAZARD_WORDS } from "@/components/lots/words";
import type { CatalogueFacets } from "@/lib/services/catalogue/facets";
import { queryToSearchParams, type CatalogueQuery } from "@/lib/validation/catalogue";
import { GRADE_WORDS, STATUS_WORDS } from "./words";

type ListKey = "status" | "family" | "condition" | "basis" | "grade" | "hazard" | "sets";

/** The address of this search with one value of a list filter switched on or off (back to the first page). */
function toggled(q: CatalogueQuery, key: ListKey, value: string): string {
  const current = q[key] as readonly string[];
  const next = current.includes(value) ? current.filter((v) => v !== value) : [...current, value];
  return `/catalogue?${queryToSearchParams({ ...q, [key]: next, cursor: undefined }).toString()}`;
}

function flagged(q: CatalogueQuery, key: "noVacuumLoss" | "tested" | "record", value: string | undefined): string {
  return `/catalogue?${queryToSearchParams({ ...q, [key]: q[key] === value ? undefined : value, cursor: undefined }).toString()}`;
}

function Option({ href, on, label, count }: { href: string; on: boolean; label: string; count?: number }) {
  return (
    <li>
      <Link
        href={href}
        aria-current={on ? "true" : undefined}
        className={`flex justify-between gap-2 rounded px-1.5 py-1 text-sm hover:bg-flash-100 ${on ? "bg-glow-50 font-semibold text-glow-700" : "text-flash-800"}`}
      >
        <span>
          {on ? "✓ " : ""}
          {label}
        </span>
        {count !== undefined ? <span className="code text-flash-500">{count}</span> : null}
      </Link>
    </li>
  );
}

function Group({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <div className="space-y-1">
      <h3 className="text-xs font-semibold uppercase tracking-wide text-flash-600">{title}</h3>
      <ul>{children}</ul>
    </div>
  );
}

function listOptions(q: CatalogueQuery, key: ListKey, counts: Record<string, number>, words: Record<string, string>) {
  const values = [...new Set([...Object.keys(counts), ...(q[key] as string[])])];
  return values.map((v) => (
    <Option
      key={v}
      href={toggled(q, key, v)}
      on={(q[key] as string[]).includes(v)}
      label={words[v] ?? v}
      count={counts[v] ?? 0}
    />
  ));
}

/** Filters with the count of lots each would leave; every choice is a link, so the address holds the search. */
export function Filters({ q, facets }: { q: CatalogueQuery; facets: CatalogueFacets }) {
  return (
    <div className="space-y-4">
      <Group title="Sale status">{listOptions(q, "status", facets.status, STATUS_WORDS)}</Group>
      <Group title="Type family">{listOptions(q, "family", facets.family, {})}</Group>
      <Group title="Condition">{listOptions(q, "condition", facets.condition, CONDITION_WORDS)}</Group>
      <Group title="Maker">{listOptions(q, "basis", facets.basis, BASIS_WORDS)}</Group>
      <Group title="Tested, graded">
        <Option href={flagged(q, "tested", "yes")} on={q.tested === "yes"} label="Tested" count={facets.tested} />
        {listOptions(q, "grade", facets.grade, GRADE_WORDS)}
      </Group>
      <Group title="Evidence">
        <Option
          href={flagged(q, "noVacuumLoss", "1")}
          on={q.noVacuumLoss === "1"}
          label="No white getters"
          count={facets.noVacuumLoss}
        />
        <Option
          href={toggled(q, "sets", "pairs")}
          on={q.sets.includes("pairs")}
          label="Matched pairs"
          count={facets.pairs}
        />
        <Option
          href={toggled(q, "sets", "quads")}
          on={q.sets.includes("quads")}
          label="Matched quads"
          count={facets.quads}
        />
        <Option
          href={flagged(q, "record", "clean")}
          on={q.record === "clean"}
          label="Consignor with no upheld claims"
        />
      </Group>
      <Group title="Hazards">
        {listOptions(q, "hazard", facets.hazard, HAZARD_WORDS)}
        <Option href={toggled(q, "hazard", "none")} on={q.hazard.includes("none")} label="No hazard flags" />
      </Group>
    </div>
  );
}
