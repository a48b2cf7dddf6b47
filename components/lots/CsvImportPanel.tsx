"use client";

import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import type { ImportReport } from "@/lib/services/lot-import";

type Phase =
  | { kind: "idle" }
  | { kind: "sending"; pct: number; mode: "preview" | "apply" }
  | { kind: "checking"; mode: "preview" | "apply" };

function post(
  lotId: string,
  csv: string,
  name: string,
  mode: "preview" | "apply",
  onPct: (p: number) => void,
): Promise<ImportReport & { added?: number }> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", `/api/lots/${lotId}/import?mode=${mode}&name=${encodeURIComponent(name)}`);
    xhr.setRequestHeader("content-type", "text/csv");
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onPct(Math.round((e.loaded / e.total) * 100));
    };
    xhr.onload = () => {
      let body: { error?: { message: string; fields?: Record<string, string> } } & ImportReport;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        return reject(new Error(`Import failed (${xhr.status})`));
      }
      if (xhr.status >= 300) {
        const fields = body.error?.fields ? Object.entries(body.error.fields).map(([k, v]) => `${k}: ${v}`) : [];
        return reject(Object.assign(new Error(body.error?.message ?? "Import failed"), { fields }));
      }
      resolve(body);
    };
    xhr.onerror = () => reject(new Error("The connection dropped during the upload"));
    xhr.send(csv);
  });
}

/**
 * Bulk import of tubes and readings from a CSV in our own format: preview
 * with per-row errors and line numbers, nothing written until confirmed,
 * upload progress for large files, and re-imports that add nothing twice.
 */
export function CsvImportPanel({ lotId, onApplied }: { lotId: string; onApplied: () => void }) {
  const [file, setFile] = useState<{ name: string; text: string } | null>(null);
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const [preview, setPreview] = useState<ImportReport | null>(null);
  const [message, setMessage] = useState<{ tone: "fault" | "sound"; text: string; lines?: string[] } | null>(null);

  async function run(mode: "preview" | "apply") {
    if (!file) return;
    setMessage(null);
    setPhase({ kind: "sending", pct: 0, mode });
    try {
      const r = await post(lotId, file.text, file.name, mode, (pct) =>
        setPhase(pct >= 100 ? { kind: "checking", mode } : { kind: "sending", pct, mode }),
      );
      if (mode === "preview") setPreview(r);
      else {
        setPreview(null);
        setFile(null);
        setMessage({
          tone: "sound",
          text: `Imported ${r.added ?? 0} rows${r.counts.alreadyImported ? `; ${r.counts.alreadyImported} were already in the lot and were not added again` : ""}.`,
        });
        onApplied();
      }
    } catch (e) {
      setMessage({ tone: "fault", text: (e as Error).message, lines: (e as { fields?: string[] }).fields });
    } finally {
      setPhase({ kind: "idle" });
    }
  }

  const busy = phase.kind !== "idle";
  return (
    <section aria-labelledby="import-h" className="card space-y-3">
      <h2 id="import-h" className="text-lg font-semibold">
        Import tubes and readings from a CSV file
      </h2>
      <p className="text-sm text-flash-700">
        One row per tested tube, or one row per bundle of untested tubes.{" "}
        <a download href="/api/lots/import-template" className="underline">
          Download the template
        </a>{" "}
        (the columns are explained in the README). Nothing is added until you confirm; importing the same rows again
        adds nothing.
      </p>
      <label className="block text-sm">
        <span className="label">CSV file</span>
        <input
          type="file"
          accept=".csv,text/csv"
          className="mt-1 block text-sm"
          disabled={busy}
          onChange={async (e) => {
            const f = e.target.files?.[0];
            setPreview(null);
            setMessage(null);
            setFile(f ? { name: f.name, text: await f.text() } : null);
          }}
        />
      </label>
      {phase.kind === "sending" ? (
        <p className="flex items-center gap-2 text-sm">
          <progress max={100} value={phase.pct} aria-label="Upload progress" className="h-2 w-56" /> Sending {phase.pct}
          %
        </p>
      ) : phase.kind === "checking" ? (
        <p role="status" className="flex items-center gap-2 text-sm">
          <progress aria-label="Checking the rows" className="h-2 w-56" /> Checking every row…
        </p>
      ) : null}
      {message ? (
        <FormAlert tone={message.tone}>
          {message.text}
          {message.lines?.length ? (
            <ul className="mt-1 list-disc pl-5">
              {message.lines.map((l) => (
                <li key={l}>{l}</li>
              ))}
            </ul>
          ) : null}
        </FormAlert>
      ) : null}
      <div className="flex gap-2">
        <button type="button" className="btn-quiet" disabled={!file || busy} onClick={() => void run("preview")}>
          Check the file
        </button>
        <button
          type="button"
          className="btn-primary"
          disabled={!preview || preview.errors.length > 0 || preview.counts.new === 0 || busy}
          onClick={() => void run("apply")}
        >
          Import {preview ? preview.counts.new : ""} rows
        </button>
      </div>
      {preview ? (
        <div className="space-y-2 text-sm">
          <p role="status">
            {preview.rows.length} readable rows: {preview.counts.new} new, {preview.counts.alreadyImported} already in
            the lot · {preview.errors.length} problems · {preview.warnings.length} notes
            {preview.fileSeenBefore ? " · this file was imported before" : ""}
          </p>
          {preview.errors.length ? (
            <div role="alert" className="rounded-md border border-fault-600 bg-fault-50 p-2">
              <p className="font-medium text-fault-700">Fix these and check the file again:</p>
              <ul className="list-disc pl-5 text-fault-700">
                {preview.errors.map((e, i) => (
                  <li key={i}>
                    {e.line ? `Line ${e.line}` : "File"}
                    {e.column ? `, ${e.column}` : ""}: {e.message}
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
          {preview.warnings.length ? (
            <details>
              <summary className="cursor-pointer">Notes ({preview.warnings.length})</summary>
              <ul className="list-disc pl-5 text-flash-700">
                {preview.warnings.map((w, i) => (
                  <li key={i}>
                    {w.line ? `Line ${w.line}` : "File"}
                    {w.column ? `, ${w.column}` : ""}: {w.message}
                  </li>
                ))}
              </ul>
            </details>
          ) : null}
          <div className="max-h-64 overflow-auto rounded border border-flash-200">
            <table className="w-full">
              <thead className="sticky top-0 bg-flash-100 text-left">
                <tr>
                  <th className="px-2 py-1 font-medium">Line</th>
                  <th className="px-2 py-1 font-medium">Type</th>
                  <th className="px-2 py-1 font-medium">Qty</th>
                  <th className="px-2 py-1 font-medium">Label</th>
                  <th className="px-2 py-1 font-medium">Tested</th>
                  <th className="px-2 py-1 font-medium">Status</th>
                </tr>
              </thead>
              <tbody>
                {preview.rows.map((r) => (
                  <tr key={r.line} className="border-t border-flash-100">
                    <td className="px-2 py-0.5">{r.line}</td>
                    <td className="code px-2 py-0.5">
                      {r.designation}
                      {r.flagged ? <span className="ml-1 font-sans text-xs text-glow-700">check type</span> : null}
                    </td>
                    <td className="px-2 py-0.5">{r.quantity}</td>
                    <td className="px-2 py-0.5">{r.label ?? ""}</td>
                    <td className="px-2 py-0.5">{r.tested ? "yes" : "no"}</td>
                    <td className="px-2 py-0.5">{r.alreadyImported ? "already in the lot" : "new"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      ) : null}
    </section>
  );
}
