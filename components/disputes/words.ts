import type { CaseRole } from "@/lib/disputes/parties";

/** Each author's role in a claim, in words (colour only supports it). */
export const CASE_ROLE_WORDS: Record<CaseRole, string> = {
  buyer: "Buyer",
  consignor: "Consignor",
  mediator: "Mediator",
  house: "House",
};

export const CASE_ROLE_TONE: Record<CaseRole, string> = {
  buyer: "border-glow-200 bg-glow-50 text-glow-700",
  consignor: "border-flash-300 bg-flash-100 text-flash-800",
  mediator: "border-sound-600 bg-sound-50 text-sound-700",
  house: "border-flash-400 bg-white text-flash-800",
};

export const utcText = (iso: string) => `${iso.slice(0, 16).replace("T", " ")} UTC`;
