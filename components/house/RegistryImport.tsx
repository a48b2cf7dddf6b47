"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { ApiClientError, apiFetch } from "@/lib/client/api";

type Row = {
  code: string;
  makerName: string;
  isDemo: boolean;
  notes: string;
  change: "new" | "changed" | "unchanged";
  previousMaker?: string;
};
type Preview = { rows: Row[]; errors: { line: number; message: string }[]; counts: Record<Row["change"], number> };

const TEMPLATE = "code,maker_name,is_demo,notes\nX17,Aldergrove Electron Works,true,Invented demo code\n";

/** The route's message, with any per-field messages after it. */
function describe(e: unknown): string {
  if (!(e instanceof ApiClientError)) return e instanceof Error ? e.message : "Import failed";
  const fields = e.fields
    ? Object.entries(e.fields)
        .map(([k, v]) => `${k}: ${v}`)
        .join("; ")
    : "";
  return `${e.message}${fields ? ` (${fields})` : ""}`;
}

/** Import the maker registry from CSV: preview every row, then apply in one go. */
export function RegistryImport() {
  const router = useRouter();
  const [csv, setCsv] = useState("");
  const [preview, setPreview] = useState<Preview | null>(null);
  const [message, setMessage] = useState<{ tone: "fault" | "sound"; text: string } | null>(null);
  const send = useMutation({
    mutationFn: (mode: "preview" | "apply") =>
      apiFetch<Preview>(`/api/valves/makers/import?mode=${mode}`, { body: csv, contentType: "text/csv" }),
    onMutate: () => setMessage(null),
    onSuccess: (p, mode) => {
      setPreview(p);
      if (mode === "apply") {
        setMessage({
          tone: "sound",
          text: `Imported: ${p.counts.new} new, ${p.counts.changed} changed, ${p.counts.unchanged} already as listed.`,
        });
        router.refresh();
      }
    },
    onError: (e) => setMessage({ tone: "fault", text: describe(e) }),
  });
  const busy = send.isPending;
  const run = (mode: "preview" | "apply") => send.mutate(mode);

  return (
    <div className="card space-y-3">
      <h2 className="text-lg font-semibold">Import from CSV</h2>
      <p className="text-sm text-flash-700">
        Columns <span className="code">code, maker_name, is_demo, notes</span>, with a header row.{" "}
        <a
          className="underline"
          href={`data:text/csv;charset=utf-8,${encodeURIComponent(TEMPLATE)}`}
          download="maker-registry-template.csv"
        >
          Download a template
        </a>
        . Nothing is written until you apply; a file with any bad row is refused whole; applying the same file twice
        changes nothing.
      </p>
      <label htmlFor="registry-file" className="label">
        CSV file
      </label>
      <input
        id="registry-file"
        type="file"
        accept=".csv,text/csv"
        className="text-sm"
        onChange={async (e) => {
          const f = e.target.files?.[0];
          if (f) {
            setCsv(await f.text());
            setPreview(null);
          }
        }}
      />
      <label htmlFor="registry-text" className="label">
        or paste it
      </label>
      <textarea
        id="registry-text"
        rows={5}
        className="input code"
        value={csv}
        onChange={(e) => {
          setCsv(e.target.value);
          setPreview(null);
        }}
      />
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <div className="flex gap-2">
        <button type="button" className="btn-quiet" disabled={!csv || busy} onClick={() => run("preview")}>
          Preview
        </button>
        <button
          type="button"
          className="btn-primary"
          disabled={!preview || preview.errors.length > 0 || busy}
          onClick={() => run("apply")}
        >
          Apply import
        </button>
      </div>
      {preview ? (
        <div className="space-y-2 text-sm">
          <p role="status">
            {preview.counts.new} new · {preview.counts.changed} changed · {preview.counts.unchanged} unchanged ·{" "}
            {preview.errors.length} with problems
          </p>
          {preview.errors.length ? (
            <ul className="list-disc pl-5 text-fault-700">
              {preview.errors.map((e, i) => (
                <li key={i}>
                  Line {e.line}: {e.message}
                </li>
              ))}
            </ul>
          ) : null}
          <table className="w-full">
            <thead className="text-left text-flash-600">
              <tr>
                <th className="py-1 font-medium">Code</th>
                <th className="py-1 font-medium">Maker</th>
                <th className="py-1 font-medium">Demo</th>
                <th className="py-1 font-medium">Change</th>
              </tr>
            </thead>
            <tbody>
              {preview.rows.map((r) => (
                <tr key={r.code} className="border-t border-flash-100">
                  <td className="code py-1">{r.code}</td>
                  <td className="py-1">
                    {r.makerName}
                    {r.previousMaker ? <span className="text-flash-500"> (was {r.previousMaker})</span> : null}
                  </td>
                  <td className="py-1">{r.isDemo ? "demo" : ""}</td>
                  <td className="py-1">{r.change}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
