import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg p-10">
      <h1 className="text-xl font-bold">Nothing here</h1>
      <p className="mt-2 text-walnut-700">This page does not exist, or it belongs to a channel you are not a member of.</p>
      <Link className="mt-4 inline-block text-chalk-600 underline" href="/">
        Back to your board
      </Link>
    </main>
  );
}
