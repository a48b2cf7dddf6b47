"use client";

import { useRouter } from "next/navigation";
import { PhotoPanel } from "@/components/lots/PhotoPanel";
import type { CaseRole } from "@/lib/disputes/parties";
import { CASE_ROLE_WORDS } from "./words";

type Photo = {
  id: string;
  role: CaseRole;
  itemId: string | null;
  caption: string;
  width: number;
  height: number;
  at: string;
};

/** A claim's photos: anyone on the case sees them; the parties and the case's mediator add more; nobody removes any. */
export function CaseEvidence({
  caseId,
  lotId,
  photos,
  items,
  canAdd,
}: {
  caseId: string;
  lotId: string;
  photos: Photo[];
  items: { id: string; label: string }[];
  canAdd: boolean;
}) {
  const router = useRouter();
  return (
    <PhotoPanel
      lotId={lotId}
      heading="Photo evidence"
      items={items}
      editable={canAdd}
      removable={false}
      withCaption
      uploadPath={`/api/disputes/${caseId}/photos`}
      srcBase="/api/claim-photos"
      onChange={() => router.refresh()}
      photos={photos.map((p) => ({ ...p, byline: `${CASE_ROLE_WORDS[p.role]}, ${p.at.slice(0, 10)}` }))}
    />
  );
}
