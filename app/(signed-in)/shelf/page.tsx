import Link from "next/link";
import { ShelfForm } from "@/components/shelf/ShelfForm";
import { requirePageViewer } from "@/lib/auth/guards";
import { listShelf, type ShelfTubeView } from "@/lib/services/shelf";

export const metadata = { title: "Unconfirmed shelf" };

function Row({ t }: { t: ShelfTubeView }) {
  return (
    <tr className="border-t border-flash-200 align-top">
      <td className="px-3 py-2">
        <Link href={`/shelf/${t.id}`} className="code font-medium underline underline-offset-2">
          {t.designation}
        </Link>
      </td>
      <td className="px-3 py-2">{t.labelBrand || "—"}</td>
      <td className="code px-3 py-2">{[t.sourceCode, t.dateCode].filter(Boolean).join(" · ") || "—"}</td>
      <td className="px-3 py-2">{Object.keys(t.features).length}</td>
      <td className="px-3 py-2">
        {t.best ? (
          <>
            {t.best.makerName}{" "}
            <span className="text-flash-600">
              ({Math.round(t.best.similarity * 100)}%, {t.best.confidence})
            </span>
          </>
        ) : (
          <span className="text-flash-600">no candidate yet</span>
        )}
      </td>
    </tr>
  );
}

function Table({ tubes, empty }: { tubes: ShelfTubeView[]; empty: string }) {
  return (
    <div className="overflow-x-auto rounded-lg border border-flash-200 bg-white">
      <table className="min-w-full text-sm">
        <thead className="bg-flash-100 text-left text-flash-700">
          <tr>
            {["Type", "Label", "Codes", "Features", "Best candidate"].map((h) => (
              <th key={h} scope="col" className="px-3 py-2 font-medium">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {tubes.map((t) => (
            <Row key={t.id} t={t} />
          ))}
          {tubes.length === 0 ? (
            <tr>
              <td colSpan={5} className="px-3 py-3 text-flash-600">
                {empty}
              </td>
            </tr>
          ) : null}
        </tbody>
      </table>
    </div>
  );
}

export default async function ShelfPage() {
  const viewer = await requirePageViewer("shelf.use", "/shelf");
  const shelf = await listShelf(viewer);
  return (
    <div className="space-y-6">
      <header className="space-y-2">
        <h1 className="text-2xl font-semibold">Unconfirmed shelf</h1>
        <p className="max-w-3xl text-flash-700">
          Tubes whose maker you cannot confirm yet. Each is compared, by construction, with every tube a source code has
          confirmed ({shelf.profiles} maker-and-type references so far); as confirmed evidence grows, tubes here get
          strong enough matches to move off the shelf. The label is never taken as the maker.
        </p>
      </header>
      <section aria-labelledby="prop-h" className="space-y-2">
        <h2 id="prop-h" className="text-lg font-semibold">
          Strong matches to review ({shelf.proposed.length})
        </h2>
        <Table tubes={shelf.proposed} empty="None yet." />
      </section>
      <section aria-labelledby="wait-h" className="space-y-2">
        <h2 id="wait-h" className="text-lg font-semibold">
          Waiting for evidence ({shelf.waiting.length})
        </h2>
        <Table tubes={shelf.waiting} empty="Nothing waiting." />
      </section>
      <ShelfForm />
      <section aria-labelledby="conf-h" className="space-y-2">
        <h2 id="conf-h" className="text-lg font-semibold">
          Off the shelf ({shelf.confirmed.length})
        </h2>
        <Table tubes={shelf.confirmed} empty="None yet." />
      </section>
    </div>
  );
}
