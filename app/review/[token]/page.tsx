import { GuestReview } from "@/components/review/guest-review";

export const metadata = { title: "Sponsor review" };

/** A sponsor's contact reviews their part of an episode here, through the link they were mailed; no account needed. */
export default async function ReviewPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  return (
    <main className="mx-auto max-w-3xl p-4">
      <GuestReview token={token} />
    </main>
  );
}
