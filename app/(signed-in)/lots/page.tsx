import { redirect } from "next/navigation";

/** The flat list of approved lots became the catalogue: search, filters, pictures and paging. */
export default function LotsPage(): never {
  redirect("/catalogue?status=approved");
}
