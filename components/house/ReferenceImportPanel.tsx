"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { apiFetch } from "@/lib/client/api";

type Result = {
  applied: boolean;
  lines: { line: number; designation: string; action: "add" | "change" | "unchanged" }[];
  errors: { line: number; column?: string; message: string }[];
};

/**
 * Reference CSV in and out: export the table, paste or choose a file,
 * preview what each line would do, then apply (all or nothing).
 */
export function ReferenceImportPanel() {
  const router = useRouter();
  const [csv, setCsv] = useState("");
  const [reason, setReason] = useState("");
  const [result, setResult] = useState<Result | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  // A preview changes nothing; an apply is all or nothing and the same file applied twice changes nothing more.
  const importCsv = useMutation({
    mutationFn: (apply: boolean) => apiFetch<Result>("/api/valves/types/import", { json: { csv, apply, reason } }),
    onMutate: () => setProblem(null),
    onSuccess: (r) => {
      setResult(r);
      if (r.applied) router.refresh();
    },
    onError: (e) => {
      setResult(null);
      setProblem(e instanceof Error ? e.message : "Something went wrong");
    },
  });
  const send = (apply: boolean) => importCsv.mutate(apply);
  const counts = result
    ? (["add", "change", "unchanged"] as const)
        .map((a) => `${result.lines.filter((l) => l.action === a).length} ${a}`)
        .join(", ")
    : "";

  return (
    <section className="card space-y-3" aria-labelledby="ref-csv-h">
      <h2 id="ref-csv-h" className="font-semibold">
        CSV import and export
      </h2>
      <p className="text-sm">
        <a download className="underline" href="/api/valves/types/export">
          Download the table as CSV
        </a>
        . Edit it, then preview and apply; a file with any bad line changes nothing, and importing the same file twice
        changes nothing the second time.
      </p>
      <label htmlFor="ref-csv" className="label">
        CSV
      </label>
      <input
        type="file"
        accept=".csv,text/csv"
        aria-label="Choose a CSV file"
        onChange={async (e) => {
          const f = e.target.files?.[0];
          if (f) setCsv(await f.text());
        }}
      />
      <textarea id="ref-csv" rows={5} className="input code" value={csv} onChange={(e) => setCsv(e.target.value)} />
      <label htmlFor="ref-reason" className="label">
        Why
      </label>
      <input id="ref-reason" className="input" value={reason} onChange={(e) => setReason(e.target.value)} />
      <div className="flex gap-2">
        <button type="button" className="btn-quiet" onClick={() => send(false)}>
          Preview
        </button>
        <button
          type="button"
          className="btn-primary"
          disabled={!result || result.errors.length > 0 || result.applied}
          onClick={() => send(true)}
        >
          Apply
        </button>
      </div>
      {problem ? <FormAlert>{problem}</FormAlert> : null}
      {result?.errors.length ? (
        <ul className="text-sm text-fault-700" aria-label="Errors">
          {result.errors.map((x, i) => (
            <li key={i}>
              Line {x.line}
              {x.column ? ` (${x.column})` : ""}: {x.message}
            </li>
          ))}
        </ul>
      ) : null}
      {result && !result.errors.length ? (
        <p role="status" className="text-sm">
          {result.applied ? "Applied" : "Preview"}: {counts}.
        </p>
      ) : null}
    </section>
  );
}
