"use client";
import { useRouter } from "next/navigation";

export function ChannelSwitcher({ channels, current }: { channels: { id: string; name: string }[]; current: string }) {
  const router = useRouter();
  if (channels.length < 2) return <span className="font-medium">{channels.find((c) => c.id === current)?.name}</span>;
  return (
    <label className="flex items-center gap-2">
      <span className="sr-only">Channel</span>
      <select
        className="rounded-plank border border-walnut-600 bg-walnut-800 px-2 py-1 text-timber-50"
        value={current}
        onChange={(e) => router.push(`/c/${e.target.value}`)}
      >
        {channels.map((c) => (
          <option key={c.id} value={c.id}>
            {c.name}
          </option>
        ))}
      </select>
    </label>
  );
}
