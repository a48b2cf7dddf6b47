"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { CONDITION_VALUES } from "@/lib/validation/lots";
import { CONDITION_WORDS } from "@/components/lots/words";

/** A dated correction to an approved lot, shown to everyone who reads it. */
export function AmendmentForm({ lotId, items }: { lotId: string; items: { id: string; label: string }[] }) {
  const router = useRouter();
  const [itemId, setItemId] = useState("");
  const [description, setDescription] = useState("");
  const [quantity, setQuantity] = useState("");
  const [condition, setCondition] = useState("");
  const [vacuum, setVacuum] = useState("");
  const { message, run } = useApiSubmit();

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    await run(async () => {
      await apiFetch(`/api/house/lots/${lotId}/amendments`, {
        json: {
          itemId: itemId || null,
          description,
          ...(itemId && quantity ? { quantity: Number(quantity) } : {}),
          ...(itemId && condition ? { condition } : {}),
          ...(itemId && vacuum ? { vacuumLoss: vacuum === "lost" } : {}),
        },
      });
      setDescription("");
      router.refresh();
      return "Amendment recorded.";
    });
  }

  return (
    <form onSubmit={submit} className="card space-y-3" aria-label="Record an amendment">
      <h2 className="text-lg font-semibold">Record an amendment</h2>
      {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
      <Field id="amend-item" label="Item (optional)">
        <select id="amend-item" className="input" value={itemId} onChange={(e) => setItemId(e.target.value)}>
          <option value="">The lot as a whole</option>
          {items.map((i) => (
            <option key={i.id} value={i.id}>
              {i.label}
            </option>
          ))}
        </select>
      </Field>
      {itemId ? (
        <div className="grid gap-3 sm:grid-cols-3">
          <Field id="amend-qty" label="New quantity">
            <input
              id="amend-qty"
              type="number"
              min={1}
              className="input"
              value={quantity}
              onChange={(e) => setQuantity(e.target.value)}
            />
          </Field>
          <Field id="amend-cond" label="New condition">
            <select id="amend-cond" className="input" value={condition} onChange={(e) => setCondition(e.target.value)}>
              <option value="">Unchanged</option>
              {CONDITION_VALUES.map((c) => (
                <option key={c} value={c}>
                  {CONDITION_WORDS[c]}
                </option>
              ))}
            </select>
          </Field>
          <Field id="amend-vac" label="Getter">
            <select id="amend-vac" className="input" value={vacuum} onChange={(e) => setVacuum(e.target.value)}>
              <option value="">Unchanged</option>
              <option value="lost">White (vacuum lost)</option>
              <option value="ok">Silver (vacuum kept)</option>
            </select>
          </Field>
        </div>
      ) : null}
      <Field id="amend-desc" label="What changed and why">
        <textarea
          id="amend-desc"
          rows={2}
          className="input"
          value={description}
          onChange={(e) => setDescription(e.target.value)}
        />
      </Field>
      <button type="submit" className="btn-quiet" disabled={description.trim().length < 5}>
        Record amendment
      </button>
    </form>
  );
}
