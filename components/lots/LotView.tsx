import { CautionStrip } from "@/components/CautionStrip";
import { ConsignorRecord } from "@/components/disputes/ConsignorRecord";
import type { TrackRecord } from "@/lib/disputes/rules";
import type { LotSummary, NominalPoint } from "@/lib/lots/summary";
import { formatCents } from "@/lib/money/cents";
import type { getLot } from "@/lib/services/lots";
import { ItemsGrid } from "./ItemsGrid";
import { LotSummaryPanel } from "./LotSummaryPanel";
import { LotTrail } from "./LotTrail";
import { PhotoGallery } from "./PhotoGallery";
import { StateBadge } from "./StateBadge";
import { TESTER_WORDS } from "./words";

type Data = Awaited<ReturnType<typeof getLot>>;

/** A lot as a reader sees it: summary first, then items, photos, provenance and the trail. */
export function LotView({
  data,
  summary,
  chart,
  actions,
  record,
}: {
  data: Data;
  summary: LotSummary;
  chart: NominalPoint[];
  actions?: React.ReactNode;
  record?: TrackRecord;
}) {
  const { lot } = data;
  return (
    <article className="space-y-6">
      <header className="space-y-2">
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-semibold">{lot.title}</h1>
          <StateBadge state={lot.state} />
        </div>
        <p className="text-sm text-flash-700">
          {lot.consignorName ? (
            <>
              Consigned by <strong>{lot.consignorName}</strong> ·{" "}
            </>
          ) : null}
          {lot.shippingOrigin ? `Ships from ${lot.shippingOrigin} · ` : ""}
          {TESTER_WORDS[lot.testerKind] ?? lot.testerKind}
          {lot.estimateLowCents != null && lot.estimateHighCents != null ? (
            <>
              {" "}
              · house estimate{" "}
              <strong>
                {formatCents(lot.estimateLowCents)}–{formatCents(lot.estimateHighCents)}
              </strong>
            </>
          ) : null}
          {lot.reserveCents != null ? (
            <>
              {" "}
              · reserve {formatCents(lot.reserveCents)} <span className="text-flash-500">(not shown to bidders)</span>
            </>
          ) : null}
        </p>
        {record ? <ConsignorRecord record={record} /> : null}
      </header>
      {actions}
      <CautionStrip anchor="high-voltage">
        Testing these tubes puts lethal voltages on the tester; handle glass by the base and pack each tube on its own.
      </CautionStrip>
      <LotSummaryPanel summary={summary} chart={chart} />
      <section aria-labelledby="items-h" className="space-y-2">
        <h2 id="items-h" className="text-lg font-semibold">
          Items
        </h2>
        <ItemsGrid items={data.items} editable={false} />
      </section>
      <section aria-labelledby="photos-h" className="space-y-3">
        <h2 id="photos-h" className="text-lg font-semibold">
          Photos <span className="text-sm font-normal text-flash-600">({data.photos.length})</span>
        </h2>
        <PhotoGallery
          photos={data.photos}
          labelOf={Object.fromEntries(data.items.map((i) => [i.id, `Line ${i.position}: ${i.designation}`]))}
        />
      </section>
      <section aria-labelledby="prov-h" className="card space-y-1">
        <h2 id="prov-h" className="font-semibold">
          Provenance, in the consignor&apos;s words
        </h2>
        <p className="whitespace-pre-wrap text-sm text-flash-800">{lot.provenance || "Not given."}</p>
        {lot.testerNotes ? <p className="text-sm text-flash-700">Tester: {lot.testerNotes}</p> : null}
      </section>
      <section aria-labelledby="trail-h" className="space-y-2">
        <h2 id="trail-h" className="text-lg font-semibold">
          Trail and amendments
        </h2>
        <LotTrail events={data.events} />
      </section>
    </article>
  );
}
