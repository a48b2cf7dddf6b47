/** Reading claims: a person's own cases, the mediators' queue, and one case in full. */
import type { Viewer } from "../../auth/guards";
import { isOpenState } from "../../disputes/states";
import { loadCase, requireMediator } from "./permissions";
import { presentCase, presentSummary, type CaseSummary, type CaseView } from "./presenters";
import { caseHead, summariesForMediator, summariesForParty } from "./tables/disputes";
import { claimedLines } from "./tables/dispute-items";
import { evidenceOf } from "./tables/dispute-evidence";
import { messagesOf } from "./tables/dispute-messages";
import { displayNames } from "./tables/users";

/** The viewer's own cases, as buyer or consignor. */
export async function myCases(viewer: Viewer): Promise<CaseSummary[]> {
  return (await summariesForParty(viewer.id)).map((r) => presentSummary(r, viewer));
}

/** The mediators' queue: open cases nobody has taken, oldest first, and the viewer's own open cases. */
export async function mediationQueue(
  viewer: Viewer,
): Promise<{ waiting: CaseSummary[]; mine: CaseSummary[]; recent: CaseSummary[] }> {
  requireMediator(viewer, "Only mediators see the queue");
  const all = (await summariesForMediator(viewer.id)).map((r) => presentSummary(r, viewer));
  return {
    waiting: all.filter((c) => !c.mediator && isOpenState(c.state)),
    mine: all.filter((c) => c.mine && isOpenState(c.state)),
    recent: all
      .filter((c) => c.mine && !isOpenState(c.state))
      .reverse()
      .slice(0, 20),
  };
}

/** One case in full, for its parties, the mediators and the house. */
export async function getCase(viewer: Viewer, id: string): Promise<CaseView> {
  const { d, role } = await loadCase(viewer, id);
  const [head, items, messages, photos, names] = await Promise.all([
    caseHead(id),
    claimedLines(id),
    messagesOf(id),
    evidenceOf(id),
    displayNames([d.buyer_id, d.consignor_id, d.decided_by ?? d.buyer_id]),
  ]);
  if (!head) throw new Error(`claim ${id} has no lot or invoice`);
  return presentCase({ d, role, head, items, messages, photos, names });
}
