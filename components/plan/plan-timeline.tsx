import { formatMinutes } from "@/lib/build-plan";

interface Bar {
  id: string;
  label: string;
  start: number;
  activeEnd: number;
  end: number;
  critical: boolean;
  failed: boolean;
}

/**
 * The build on one time axis: a solid bar for hands-on time, a hatched bar
 * for the wait after it (glue cure, finish dry). Critical-path steps carry a
 * heavy outline, so the producer sees why the build needs several days.
 */
export function PlanTimeline({ bars, total }: { bars: Bar[]; total: number }) {
  if (bars.length === 0) return null;
  const width = 900;
  const labelW = 210;
  const rowH = 26;
  const top = 24;
  const span = Math.max(total, 60);
  const x = (m: number) => labelW + (m / span) * (width - labelW - 12);
  const day = 1440;
  const tickStep = span > 2 * day ? day : span > 6 * 60 ? 120 : span > 120 ? 30 : 10;
  const ticks = Array.from({ length: Math.floor(span / tickStep) + 1 }, (_, i) => i * tickStep);
  const height = top + bars.length * rowH + 8;
  return (
    <figure className="rounded-plank border border-timber-300 bg-white p-2">
      <p className="mb-1 text-xs text-walnut-700 sm:hidden" aria-hidden>
        Swipe sideways to see the whole timeline →
      </p>
      {/* Focusable so keyboard users can scroll it too (WCAG 2.1.1). */}
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Build timeline, scrolls sideways">
      <svg viewBox={`0 0 ${width} ${height}`} width="100%" role="img" aria-label={`Build timeline: ${bars.length} steps over ${formatMinutes(total)} elapsed, not clock times.`} className="min-w-[640px]">
        <defs>
          <pattern id="wait-hatch" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect className="fill-timber-100" width="6" height="6" />
            <line className="stroke-walnut-500" x1="0" y1="0" x2="0" y2="6" strokeWidth="2" />
          </pattern>
        </defs>
        {ticks.map((t) => (
          <g key={t}>
            <line className="stroke-timber-200" x1={x(t)} x2={x(t)} y1={top - 6} y2={height - 4} />
            <text className="fill-walnut-600" x={x(t)} y={top - 10} fontSize="10" textAnchor="middle" fontFamily="JetBrains Mono, monospace">
              {t === 0 ? "start" : `+${formatMinutes(t)}`}
            </text>
          </g>
        ))}
        {bars.map((b, i) => {
          const y = top + i * rowH + 4;
          return (
            <g key={b.id}>
              <text className="fill-walnut-900" x={labelW - 8} y={y + 13} fontSize="12" textAnchor="end">
                {b.label.length > 30 ? `${b.label.slice(0, 29)}…` : b.label}
              </text>
              {b.activeEnd > b.start ? (
                <rect x={x(b.start)} y={y} width={Math.max(2, x(b.activeEnd) - x(b.start))} height={18} className={`${b.failed ? "fill-fault-700" : "fill-chalk-600"} ${b.critical ? "stroke-walnut-900" : "stroke-none"}`} strokeWidth={b.critical ? 2 : 0}>
                  <title>{`${b.label}: hands-on ${formatMinutes(b.activeEnd - b.start)}${b.critical ? " (critical path)" : ""}`}</title>
                </rect>
              ) : null}
              {b.end > b.activeEnd ? (
                <rect x={x(b.activeEnd)} y={y} width={Math.max(2, x(b.end) - x(b.activeEnd))} height={18} fill="url(#wait-hatch)" className={b.critical ? "stroke-walnut-900" : "stroke-walnut-500"} strokeWidth={b.critical ? 2 : 1}>
                  <title>{`${b.label}: wait ${formatMinutes(b.end - b.activeEnd)}`}</title>
                </rect>
              ) : null}
            </g>
          );
        })}
      </svg>
      </div>
      <figcaption className="mt-1 flex flex-wrap gap-4 text-xs text-walnut-700">
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-5 bg-chalk-600" aria-hidden /> hands-on time
        </span>
        <span className="flex items-center gap-1">
          <svg width="20" height="12" aria-hidden>
            <rect className="stroke-walnut-500" width="20" height="12" fill="url(#wait-hatch)" />
          </svg>
          wait (cure, dry, acclimatise)
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-5 border-2 border-walnut-900" aria-hidden /> critical path
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-5 bg-fault-700" aria-hidden /> failed step
        </span>
        <span>Axis: elapsed time from the first step, not clock time.</span>
      </figcaption>
    </figure>
  );
}
