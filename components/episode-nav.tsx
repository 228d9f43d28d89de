"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

export function EpisodeNav({ base }: { base: string }) {
  const path = usePathname();
  const items = [
    { href: base, label: "Overview" },
    { href: `${base}/plan`, label: "Build plan" },
    { href: `${base}/cut-list`, label: "Cut list" },
    { href: `${base}/script`, label: "Script" },
    { href: `${base}/shots`, label: "Shot list" },
    { href: `${base}/schedule`, label: "Schedule" },
    { href: `${base}/footage`, label: "Footage" },
    { href: `${base}/coverage`, label: "B-roll coverage" },
    { href: `${base}/sponsors`, label: "Sponsor checks" },
    { href: `${base}/publish`, label: "Publish" },
  ];
  return (
    <nav aria-label="Episode" className="flex flex-wrap gap-1 border-b border-timber-300">
      {items.map((i) => {
        const current = i.href === base ? path === base : path.startsWith(i.href);
        return (
          <Link
            key={i.href}
            href={i.href}
            aria-current={current ? "page" : undefined}
            className={`-mb-px rounded-t-plank border px-3 py-1.5 text-sm ${current ? "border-timber-300 border-b-timber-50 bg-timber-50 font-bold" : "border-transparent text-walnut-700 hover:text-walnut-900"}`}
          >
            {i.label}
          </Link>
        );
      })}
    </nav>
  );
}
