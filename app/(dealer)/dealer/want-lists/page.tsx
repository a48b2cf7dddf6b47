import Link from "next/link";
import { WantListRow } from "@/components/catalogue/WantListRow";
import { requirePageViewer } from "@/lib/auth/guards";
import { MAX_WANT_LISTS } from "@/lib/validation/want-lists";
import { listWantLists } from "@/lib/services/want-lists";

export const metadata = { title: "Want lists" };

export default async function WantListsPage() {
  const viewer = await requirePageViewer("lots.bid", "/dealer/want-lists");
  const lists = await listWantLists(viewer);
  return (
    <div className="space-y-5">
      <header className="space-y-2">
        <h1 className="text-2xl font-semibold">Want lists</h1>
        <p className="max-w-3xl text-flash-700">
          A want list is a standing search for a type. When the house lists a lot that meets it, or offers one in a
          sale, you hear at once in Getterline and in one e-mail a day at most. Save one from any{" "}
          <Link href="/catalogue" className="underline">
            catalogue
          </Link>{" "}
          search for a type. You may keep up to {MAX_WANT_LISTS}.
        </p>
      </header>
      {lists.length ? (
        <ul className="space-y-3">
          {lists.map((l) => (
            <WantListRow key={l.id} list={l} />
          ))}
        </ul>
      ) : (
        <p className="card text-flash-700">
          No want lists yet. Search the{" "}
          <Link href="/catalogue" className="underline">
            catalogue
          </Link>{" "}
          for a type, then save the search.
        </p>
      )}
    </div>
  );
}
