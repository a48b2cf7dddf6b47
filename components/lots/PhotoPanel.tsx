"use client";

import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { FormAlert } from "@/components/forms/Field";
import { apiFetch } from "@/lib/client/api";
import { ACCEPTED_PHOTO_LABELS, MAX_PHOTO_BYTES, PHOTO_ACCEPT_ATTRIBUTE } from "@/lib/photos/formats";

type Photo = { id: string; itemId: string | null; caption: string; width: number; height: number; byline?: string };
type Upload = { name: string; progress: number; error?: string };

function send(
  path: string,
  file: File,
  itemId: string,
  caption: string,
  onProgress: (p: number) => void,
): Promise<void> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", path);
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(Math.round((e.loaded / e.total) * 100));
    };
    xhr.onload = () => {
      if (xhr.status < 300) return resolve();
      try {
        reject(new Error(JSON.parse(xhr.responseText).error.message));
      } catch {
        reject(new Error(`Upload failed (${xhr.status})`));
      }
    };
    xhr.onerror = () => reject(new Error("The connection dropped during the upload"));
    const form = new FormData();
    form.append("file", file);
    if (itemId) form.append("itemId", itemId);
    if (caption) form.append("caption", caption);
    xhr.send(form);
  });
}

/**
 * Photos of a lot (or of a claim's evidence): a gallery for everyone who may
 * see it; uploads with progress while `editable`. Claim evidence passes its
 * own upload and image paths, takes captions, and cannot be removed.
 */
export function PhotoPanel({
  lotId,
  photos,
  items,
  editable,
  onChange,
  uploadPath,
  srcBase = "/api/photos",
  removable = editable,
  withCaption = false,
  heading = "Photos",
}: {
  lotId: string;
  photos: Photo[];
  items: { id: string; label: string }[];
  editable: boolean;
  onChange?: () => void;
  uploadPath?: string;
  srcBase?: string;
  removable?: boolean;
  withCaption?: boolean;
  heading?: string;
}) {
  const [caption, setCaption] = useState("");
  const [uploads, setUploads] = useState<Upload[]>([]);
  const [itemId, setItemId] = useState("");
  const [problem, setProblem] = useState<string | null>(null);

  async function onFiles(files: FileList | null) {
    if (!files) return;
    const list = [...files];
    setUploads(
      list.map((f) => ({
        name: f.name,
        progress: 0,
        ...(f.size > MAX_PHOTO_BYTES ? { error: `larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB` } : {}),
      })),
    );
    for (const [i, f] of list.entries()) {
      if (f.size > MAX_PHOTO_BYTES) continue;
      try {
        await send(uploadPath ?? `/api/lots/${lotId}/photos`, f, itemId, caption, (p) =>
          setUploads((u) => u.map((x, j) => (j === i ? { ...x, progress: p } : x))),
        );
        setUploads((u) => u.map((x, j) => (j === i ? { ...x, progress: 100 } : x)));
      } catch (e) {
        setUploads((u) => u.map((x, j) => (j === i ? { ...x, error: (e as Error).message } : x)));
      }
    }
    onChange?.();
  }

  const removal = useMutation({
    mutationFn: (id: string) => apiFetch(`/api/lots/${lotId}/photos/${id}`, { method: "DELETE" }),
    onMutate: () => setProblem(null),
    onError: (e) => setProblem(e instanceof Error ? e.message : "Could not remove the photo"),
    onSettled: () => onChange?.(),
  });
  const remove = (id: string) => removal.mutate(id);

  const itemLabel = (id: string | null) => (id ? (items.find((i) => i.id === id)?.label ?? "an item") : "the lot");
  return (
    <section aria-labelledby="photos-h" className="space-y-3">
      <h2 id="photos-h" className="text-lg font-semibold">
        {heading} <span className="text-sm font-normal text-flash-600">({photos.length})</span>
      </h2>
      {problem ? <FormAlert>{problem}</FormAlert> : null}
      {editable ? (
        <div className="card space-y-3">
          <p className="text-sm text-flash-700">
            {ACCEPTED_PHOTO_LABELS}, up to {MAX_PHOTO_BYTES / 1024 / 1024} MB each. Photos are re-encoded and every
            hidden field (camera, location) is removed. Show codes, getters and plates close up; they are the evidence
            dealers read.
          </p>
          <div className="flex flex-wrap items-end gap-3">
            <label className="text-sm">
              <span className="label">Photo of</span>
              <select className="input mt-1" value={itemId} onChange={(e) => setItemId(e.target.value)}>
                <option value="">The whole lot</option>
                {items.map((i) => (
                  <option key={i.id} value={i.id}>
                    {i.label}
                  </option>
                ))}
              </select>
            </label>
            {withCaption ? (
              <label className="text-sm">
                <span className="label">Caption</span>
                <input
                  className="input mt-1"
                  maxLength={200}
                  value={caption}
                  onChange={(e) => setCaption(e.target.value)}
                />
              </label>
            ) : null}
            <label className="text-sm">
              <span className="label">Choose photos</span>
              <input
                type="file"
                multiple
                accept={PHOTO_ACCEPT_ATTRIBUTE}
                className="mt-1 block text-sm"
                onChange={(e) => void onFiles(e.target.files)}
              />
            </label>
          </div>
          {uploads.length ? (
            <ul className="space-y-1 text-sm">
              {uploads.map((u, i) => (
                <li key={i} className="flex items-center gap-2">
                  <span className="w-48 truncate">{u.name}</span>
                  {u.error ? (
                    <span role="alert" className="text-fault-700">
                      Refused: {u.error}
                    </span>
                  ) : (
                    <progress max={100} value={u.progress} aria-label={`Upload of ${u.name}`} className="h-2 w-40">
                      {u.progress}%
                    </progress>
                  )}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {photos.length ? (
        <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4 lg:grid-cols-6">
          {photos.map((p) => (
            <li key={p.id} className="space-y-1">
              <a
                href={`${srcBase}/${p.id}?size=full`}
                target="_blank"
                rel="noreferrer"
                className="block overflow-hidden rounded-md border border-flash-200 bg-white"
              >
                {/* eslint-disable-next-line @next/next/no-img-element -- permission-checked route, not a static asset */}
                <img
                  src={`${srcBase}/${p.id}?size=thumb`}
                  alt={`Photo of ${itemLabel(p.itemId)}${p.caption ? `: ${p.caption}` : ""}`}
                  className="aspect-square w-full object-cover"
                  loading="lazy"
                />
              </a>
              <p className="text-xs text-flash-600">
                {itemLabel(p.itemId)}
                {p.caption && withCaption ? `: ${p.caption}` : ""}
                {p.byline ? ` · ${p.byline}` : ""}
              </p>
              {removable ? (
                <button type="button" className="text-xs underline" onClick={() => remove(p.id)}>
                  Remove
                </button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-flash-600">No photos yet.</p>
      )}
    </section>
  );
}
