"use client";
import Link from "next/link";
import * as Menu from "@radix-ui/react-dropdown-menu";
import { useSortable } from "@dnd-kit/sortable";
import { CSS } from "@dnd-kit/utilities";
import { format, parseISO } from "date-fns";
import type { EpisodeDto } from "@/lib/schemas/episode";
import { STAGES, STAGE_COLOURS, STAGE_INFO, type Stage } from "@/lib/stages";
import { can, canMoveEpisode } from "@/lib/permissions";
import type { Role } from "@/lib/roles";
import { ROLE_LABELS } from "@/lib/roles";

function runtime(seconds: number | null) {
  if (seconds == null) return "—";
  return `${Math.floor(seconds / 60)}:${String(seconds % 60).padStart(2, "0")}`;
}

function scriptFigure(e: EpisodeDto): string {
  if (e.scriptSeconds == null) return "—";
  if (e.targetRuntimeSeconds == null) return runtime(e.scriptSeconds);
  // Arrow as well as position so the state is not told by colour alone.
  return `${runtime(e.scriptSeconds)}${e.scriptSeconds > e.targetRuntimeSeconds ? "↑" : "↓"}`;
}

function scriptTitle(e: EpisodeDto): string {
  if (e.scriptSeconds == null) return "No script yet";
  if (e.targetRuntimeSeconds == null) return `Script runs about ${runtime(e.scriptSeconds)}; no target set`;
  const d = e.scriptSeconds - e.targetRuntimeSeconds;
  return `Script runs about ${runtime(e.scriptSeconds)} against a target of ${runtime(e.targetRuntimeSeconds)}: ${runtime(Math.abs(d))} ${d > 0 ? "over" : "under"}`;
}

export interface MoveRequest {
  id: string;
  stage: Stage;
  /** Index among the column's cards as shown. */
  index: number;
}

export function EpisodeCard({
  episode,
  channelId,
  roles,
  indexInColumn,
  columnLength,
  onMove,
}: {
  episode: EpisodeDto;
  channelId: string;
  roles: Role[];
  indexInColumn: number;
  columnLength: number;
  onMove: (m: MoveRequest) => void;
}) {
  const draggable = can(roles, "episode.move");
  const { attributes, listeners, setNodeRef, transform, transition, isDragging } = useSortable({
    id: episode.id,
    disabled: !draggable,
    data: { stage: episode.stage },
  });
  const go = (m: MoveRequest) => onMove(m);

  const moveAllowed = (to: Stage) => canMoveEpisode(roles, episode.stage, to);
  const style = { transform: CSS.Transform.toString(transform), transition };

  return (
    <li
      ref={setNodeRef}
      style={style}
      data-testid="episode-card"
      data-episode-id={episode.id}
      className={`relative rounded-plank border border-timber-300 bg-white shadow-[0_1px_0_theme(colors.timber.300)] ${isDragging ? "opacity-60 ring-2 ring-chalk-600" : ""}`}
    >
      <div className="flex">
        <span aria-hidden className="w-1.5 shrink-0 rounded-l-plank" style={{ background: STAGE_COLOURS[episode.stage] }} />
        <div className="min-w-0 flex-1 p-2.5">
          <div className="flex items-start gap-2">
            {draggable ? (
              <button
                type="button"
                className="-ml-1 mt-0.5 cursor-grab rounded-plank px-1 text-walnut-500 hover:bg-timber-100 active:cursor-grabbing"
                aria-label={`Drag ${episode.title}. Press space to pick up, arrows to move, space to drop.`}
                {...attributes}
                {...listeners}
              >
                <svg width="10" height="16" viewBox="0 0 10 16" aria-hidden>
                  {[2, 8, 14].map((y) => (
                    <g key={y}>
                      <circle cx="2.5" cy={y} r="1.4" fill="currentColor" />
                      <circle cx="7.5" cy={y} r="1.4" fill="currentColor" />
                    </g>
                  ))}
                </svg>
              </button>
            ) : null}
            <Link href={`/c/${channelId}/episodes/${episode.id}`} className="min-w-0 flex-1 font-medium leading-snug hover:underline">
              {episode.title}
            </Link>
          </div>
          <p className="mt-1.5 flex flex-wrap gap-x-3 text-xs text-walnut-700">
            <span>
              Publish <span className="num whitespace-nowrap text-walnut-900">{episode.publishDate ? format(parseISO(episode.publishDate), "d MMM yy") : "—"}</span>
            </span>
            <span>
              Target <span className="num text-walnut-900">{runtime(episode.targetRuntimeSeconds)}</span>
            </span>
          </p>
          {/* Progress figures: label above value, so a long figure never runs into its neighbour. */}
          <dl className="mt-1.5 grid grid-cols-[1.4fr_1fr_0.8fr] gap-x-1.5 rounded-plank border border-timber-200 px-1.5 py-1 text-xs">
            {[
              ["Script", scriptTitle(episode), scriptFigure(episode)],
              ["Shots", "Shots captured of planned", episode.shotsTotal ? `${episode.shotsDone}/${episode.shotsTotal}` : "—"],
              ["Gaps", "Open B-roll gaps", episode.openGaps == null ? "—" : String(episode.openGaps)],
            ].map(([label, title, value]) => (
              <div key={label} title={title} className="min-w-0">
                <dt className="text-walnut-600">{label}</dt>
                <dd className="num truncate text-walnut-900" data-testid={`card-${String(label).toLowerCase()}`}>
                  {value}
                </dd>
              </div>
            ))}
          </dl>
          {episode.sponsorState ? (
            <p className={`mt-1.5 text-xs ${episode.sponsorState === "met" ? "text-pass-700" : episode.sponsorState === "blocked" ? "font-bold text-fault-700" : "text-heed-800"}`} data-testid="card-sponsor">
              Sponsor: {episode.sponsorState === "met" ? "✓ all promises met" : episode.sponsorState === "blocked" ? "✕ a connection is not disclosed" : "● open items"}
            </p>
          ) : null}
          <div className="mt-2 flex justify-end">
            {/* An accessible menu primitive: arrow keys, type-ahead, Escape, focus return and the menu roles come from Radix. */}
            <Menu.Root modal={false}>
              <Menu.Trigger asChild>
                <button type="button" className="rounded-plank border border-timber-300 px-2 py-0.5 text-xs hover:bg-timber-100">
                  Move to…
                </button>
              </Menu.Trigger>
              <Menu.Portal>
                <Menu.Content
                  align="end"
                  sideOffset={4}
                  aria-label={`Move ${episode.title}`}
                  // Named for the episode, not for the trigger (every card's trigger reads "Move to…").
                  aria-labelledby={undefined}
                  className="z-30 min-w-48 max-w-72 rounded-plank border border-walnut-700 bg-timber-50 p-1.5 text-sm text-walnut-900 shadow-lg"
                >
                  {!draggable ? (
                    <p className="p-1 text-walnut-800" data-testid="move-refused">
                      Your role ({roles.map((r) => ROLE_LABELS[r]).join(", ")}) can read the board but not move episodes. Ask a presenter, a producer or the owner.
                    </p>
                  ) : (
                    <>
                      <Menu.Label className="px-2 pb-1 text-xs text-walnut-600">Within {STAGE_INFO[episode.stage].label}</Menu.Label>
                      <Menu.Item className="block rounded-plank px-2 py-1 outline-none data-[disabled]:cursor-not-allowed data-[disabled]:opacity-40 data-[highlighted]:bg-white data-[highlighted]:ring-2 data-[highlighted]:ring-chalk-600" disabled={indexInColumn === 0 || !moveAllowed(episode.stage)} onSelect={() => go({ id: episode.id, stage: episode.stage, index: indexInColumn - 1 })}>
                        Up one
                      </Menu.Item>
                      <Menu.Item className="block rounded-plank px-2 py-1 outline-none data-[disabled]:cursor-not-allowed data-[disabled]:opacity-40 data-[highlighted]:bg-white data-[highlighted]:ring-2 data-[highlighted]:ring-chalk-600" disabled={indexInColumn >= columnLength - 1 || !moveAllowed(episode.stage)} onSelect={() => go({ id: episode.id, stage: episode.stage, index: indexInColumn + 1 })}>
                        Down one
                      </Menu.Item>
                      <Menu.Separator className="my-1 h-px bg-timber-300" />
                      <Menu.Label className="px-2 pb-1 text-xs text-walnut-600">To another stage</Menu.Label>
                      {STAGES.filter((st) => st !== episode.stage).map((st) => (
                        <Menu.Item
                          key={st}
                          disabled={!moveAllowed(st)}
                          title={moveAllowed(st) ? undefined : "Your role cannot move episodes to this stage"}
                          onSelect={() => go({ id: episode.id, stage: st, index: Number.MAX_SAFE_INTEGER })}
                          className="flex items-center gap-2 rounded-plank px-2 py-1 outline-none data-[disabled]:cursor-not-allowed data-[disabled]:opacity-40 data-[highlighted]:bg-white data-[highlighted]:ring-2 data-[highlighted]:ring-chalk-600"
                        >
                          <span className="num w-4 text-walnut-600">{STAGE_INFO[st].step}</span>
                          {STAGE_INFO[st].label}
                        </Menu.Item>
                      ))}
                    </>
                  )}
                </Menu.Content>
              </Menu.Portal>
            </Menu.Root>
          </div>
        </div>
      </div>
    </li>
  );
}
