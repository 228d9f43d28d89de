import Link from "next/link";
import { ChannelSwitcher } from "./channel-switcher";
import { ROLE_LABELS, type Role } from "@/lib/roles";
import { can } from "@/lib/permissions";

export function AppHeader({
  channelId,
  channels,
  userName,
  roles,
  mailbox,
}: {
  channelId: string;
  channels: { id: string; name: string }[];
  userName: string;
  roles: Role[];
  mailbox: boolean;
}) {
  const link = "rounded-plank px-2 py-1 text-timber-100 hover:bg-walnut-700 hover:text-white";
  return (
    <header className="on-dark bg-walnut-900 text-timber-50 print:hidden">
      <div className="mx-auto flex max-w-[1600px] flex-wrap items-center gap-x-4 gap-y-2 px-4 py-2">
        <Link href={`/c/${channelId}`} className="rounded-plank text-lg font-bold tracking-tight">
          Jigboard
        </Link>
        <ChannelSwitcher channels={channels} current={channelId} />
        <nav aria-label="Channel" className="flex flex-wrap gap-1 text-sm">
          <Link className={link} href={`/c/${channelId}`}>
            Episodes
          </Link>
          <Link className={link} href={`/c/${channelId}/overview`}>
            At a glance
          </Link>
          <Link className={link} href={`/c/${channelId}/workshop`}>
            Workshop
          </Link>
          <Link className={link} href={`/c/${channelId}/shoot-days`}>
            Shoot days
          </Link>
          <Link className={link} href={`/c/${channelId}/sponsors`}>
            Sponsors
          </Link>
          <Link className={link} href={`/c/${channelId}/tools`}>
            Tool shelf
          </Link>
          <Link className={link} href={`/c/${channelId}/members`}>
            People
          </Link>
          <Link className={link} href={`/c/${channelId}/settings`}>
            Settings
          </Link>
          {mailbox && can(roles, "mailbox.read") ? (
            <Link className={link} href={`/c/${channelId}/mailbox`}>
              Dev mailbox
            </Link>
          ) : null}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <span>
            {userName} <span className="text-timber-300">· {roles.map((r) => ROLE_LABELS[r]).join(", ")}</span>
          </span>
          <Link className={link} href="/sign-out">
            Sign out
          </Link>
        </div>
      </div>
    </header>
  );
}
