import Link from "next/link";
import { ReferenceAddForm } from "@/components/house/ReferenceAddForm";
import { requirePageViewer } from "@/lib/auth/guards";
import { DesignationParam } from "@/lib/validation/valves";

export const metadata = { title: "Add a type" };

export default async function NewReferencePage({ searchParams }: { searchParams: Promise<{ d?: string }> }) {
  await requirePageViewer("reference.edit", "/house/reference");
  const sp = await searchParams;
  const parsed = DesignationParam.safeParse(typeof sp.d === "string" ? sp.d : "");
  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link href="/house/reference" className="underline">
          Reference data
        </Link>{" "}
        / add a type
      </p>
      <h1 className="text-2xl font-semibold">Add a type</h1>
      <p className="max-w-3xl text-flash-700">
        Give what a data sheet or handbook says and name it in the source tag; leave a figure empty rather than guess.
      </p>
      <ReferenceAddForm designation={parsed.success ? parsed.data : ""} />
    </div>
  );
}
