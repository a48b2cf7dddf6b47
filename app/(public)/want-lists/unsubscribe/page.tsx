import { UnsubscribeButton } from "@/components/catalogue/UnsubscribeButton";
import { FormAlert } from "@/components/forms/Field";
import { UnsubscribeSchema } from "@/lib/validation/want-lists";

export const metadata = { title: "Stop want-list e-mails" };

/** The stop link of a want-list digest: no sign-in; the signed link itself says whose e-mails stop. */
export default async function UnsubscribePage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const link = UnsubscribeSchema.safeParse(await searchParams);
  return (
    <div className="card max-w-xl space-y-3">
      <h1 className="text-2xl font-semibold">Stop want-list e-mails</h1>
      {link.success ? (
        <>
          <p className="text-flash-700">
            You will no longer receive the daily e-mail of lots that match your want lists. Your lists stay, and matches
            still appear in your notices.
          </p>
          <UnsubscribeButton u={link.data.u} t={link.data.t} />
        </>
      ) : (
        <FormAlert>
          This link is incomplete. Open the link from the e-mail as it is, or sign in and pause your want lists.
        </FormAlert>
      )}
    </div>
  );
}
