"use client";

import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { Field, FormAlert } from "@/components/forms/Field";
import { useApiSubmit } from "@/components/forms/useApiSubmit";
import { apiFetch } from "@/lib/client/api";
import { STANCES, STANCE_WORDS } from "@/lib/disputes/rules";
import type { CaseRole } from "@/lib/disputes/parties";
import { DisputeMessageSchema, type DisputeMessageInput } from "@/lib/validation/disputes";
import { CASE_ROLE_TONE, CASE_ROLE_WORDS, utcText } from "./words";

type Message = { id: string; role: CaseRole; author: string; body: string; at: string };

/** The claim's conversation, oldest first, each message under its author's role; and the box to write in it. */
export function CaseThread({
  caseId,
  messages,
  canWrite,
  asksStance,
  closed,
}: {
  caseId: string;
  messages: Message[];
  canWrite: boolean;
  asksStance: boolean;
  closed: boolean;
}) {
  const router = useRouter();
  const { register, handleSubmit, reset, setError, formState } = useForm<DisputeMessageInput>({
    resolver: zodResolver(DisputeMessageSchema),
    defaultValues: { body: "", clientKey: crypto.randomUUID() },
  });
  const { message, run } = useApiSubmit<DisputeMessageInput>(setError);

  async function onSubmit(v: DisputeMessageInput) {
    const ok = await run(async () => {
      await apiFetch(`/api/disputes/${caseId}/messages`, { json: { ...v, stance: asksStance ? v.stance : undefined } });
      return asksStance ? "Your answer is posted; a mediator will take the case." : "Posted.";
    });
    if (ok) {
      reset({ body: "", clientKey: crypto.randomUUID() });
      router.refresh();
    }
  }

  return (
    <section aria-labelledby="thread-h" className="space-y-3">
      <h2 id="thread-h" className="text-lg font-semibold">
        Conversation
      </h2>
      <ol className="space-y-3">
        {messages.map((m) => (
          <li key={m.id} className="card space-y-1">
            <p className="flex flex-wrap items-center gap-2 text-sm">
              <span className={`rounded-full border px-2 py-0.5 text-xs font-medium ${CASE_ROLE_TONE[m.role]}`}>
                {CASE_ROLE_WORDS[m.role]}
              </span>
              <strong>{m.author}</strong>
              <span className="text-flash-500">{utcText(m.at)}</span>
            </p>
            <p className="whitespace-pre-wrap text-sm text-flash-900">{m.body}</p>
          </li>
        ))}
      </ol>
      {closed ? (
        <p className="text-sm text-flash-600">The case is closed; the conversation is kept as it stands.</p>
      ) : canWrite ? (
        <form
          onSubmit={handleSubmit(onSubmit)}
          className="card space-y-3"
          noValidate
          aria-label={asksStance ? "Answer the claim" : "Write in the conversation"}
        >
          {message ? <FormAlert tone={message.tone}>{message.text}</FormAlert> : null}
          {asksStance ? (
            <Field id="stance" label="Your answer" error={formState.errors.stance?.message}>
              <select id="stance" className="input" {...register("stance", { setValueAs: (v) => (v ? v : undefined) })}>
                <option value="">Choose…</option>
                {STANCES.map((s) => (
                  <option key={s} value={s}>
                    {STANCE_WORDS[s]}
                  </option>
                ))}
              </select>
            </Field>
          ) : null}
          <Field
            id="body"
            label={asksStance ? "Your account" : "Message"}
            hint="Messages cannot be edited or deleted once posted."
            error={formState.errors.body?.message}
          >
            <textarea id="body" rows={4} className="input" {...register("body")} />
          </Field>
          <button type="submit" className="btn-primary" disabled={formState.isSubmitting}>
            {asksStance ? "Post my answer" : "Post"}
          </button>
        </form>
      ) : null}
    </section>
  );
}
