import Link from "next/link";

export default function NotFound() {
  return (
    <div className="max-w-xl space-y-3">
      <h1 className="text-2xl font-semibold">Nothing here</h1>
      <p className="text-flash-700">That address does not lead to a page of Getterline.</p>
      <Link href="/" className="btn-quiet">
        Back to the start
      </Link>
    </div>
  );
}
