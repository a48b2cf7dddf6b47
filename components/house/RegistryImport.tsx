"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";

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

async function post(csv: string, mode: "preview" | "apply"): Promise<Preview> {
  const res = await fetch(`/api/valves/makers/import?mode=${mode}`, {
    method: "POST",
    headers: { "content-type": "text/csv" },
    body: csv,
  });
  const body = await res.json();
  if (!res.ok) {
    const fields = body?.error?.fields
      ? Object.entries(body.error.fields as Record<string, string>)
          .map(([k, v]) => `${k}: ${v}`)
          .join("; ")
      : "";
    throw new Error(`${body?.error?.message ?? "Import failed"}${fields ? ` (${fields})` : ""}`);
  }
  return body as Preview;
}

/** Import the maker registry from CSV: preview every row, then apply in one go. */
export function RegistryImport() {
  const router = useRouter();
  const [csv, setCsv] = useState("");
  const [preview, setPreview] = useState<Preview | null>(null);
  const [message, setMessage] = useState<{ tone: "fault" | "sound"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  async function run(mode: "preview" | "apply") {
    setBusy(true);
    setMessage(null);
    try {
      const p = await post(csv, mode);
      setPreview(p);
      if (mode === "apply") {
        setMessage({
          tone: "sound",
          text: `Imported: ${p.counts.new} new, ${p.counts.changed} changed, ${p.counts.unchanged} already as listed.`,
        });
        router.refresh();
      }
    } catch (e) {
      setMessage({ tone: "fault", text: e instanceof Error ? e.message : "Import failed" });
    } finally {
      setBusy(false);
    }
  }

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
        <button type="button" className="btn-quiet" disabled={!csv || busy} onClick={() => void run("preview")}>
          Preview
        </button>
        <button
          type="button"
          className="btn-primary"
          disabled={!preview || preview.errors.length > 0 || busy}
          onClick={() => void run("apply")}
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
