import type { TrackRecord } from "@/lib/disputes/rules";

/** A consignor's attribution record as dealers see it on their lots: tubes sold, disputed and upheld. */
export function ConsignorRecord({ record }: { record: TrackRecord }) {
  const upheld = record.tubesUpheld > 0;
  return (
    <p data-testid="consignor-record" className={`text-sm ${upheld ? "text-fault-700" : "text-flash-700"}`}>
      Consignor&apos;s record on Getterline: {record.words}
      {record.upheldPerThousand != null && upheld ? ` (${record.upheldPerThousand} per 1,000 sold)` : ""}
    </p>
  );
}
