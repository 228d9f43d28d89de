import { redirect } from "next/navigation";
import { currentUser } from "@/lib/server/access/session";
import { listChannelsByUser } from "@/db/queries/channels";
import { SignOutButton } from "@/components/auth/sign-out-button";

export const dynamic = "force-dynamic";

export default async function Home() {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  const channels = await listChannelsByUser({ userId: user.id });
  if (channels[0]) redirect(`/c/${channels[0].id}`);
  return (
    <main className="mx-auto max-w-lg p-10">
      <h1 className="text-xl font-bold">No channel yet</h1>
      <p className="mt-2 text-walnut-700">You are signed in as {user.email}, but no channel has you as a member. Ask a channel owner to invite this address.</p>
      <div className="mt-4">
        <SignOutButton />
      </div>
    </main>
  );
}
