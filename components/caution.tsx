import { CAUTIONS, DEFER, type Hazard } from "@/lib/safety";

/**
 * A safety note in the signal-word style of ANSI Z535.4 / ISO 3864-2: the
 * word, its colour and a triangle symbol together, never colour alone.
 */
export function Caution({ hazard, extra }: { hazard: Hazard; extra?: string }) {
  const c = CAUTIONS[hazard];
  const warning = c.signal === "WARNING";
  return (
    <div role="note" className="flex gap-2 rounded-plank border border-walnut-900 bg-white text-sm" data-testid={`caution-${hazard}`}>
      <div className={`flex shrink-0 items-center gap-1 px-2 py-1 font-bold text-walnut-900 ${warning ? "bg-hazard-warning" : "bg-hazard-caution"}`}>
        <svg width="16" height="14" viewBox="0 0 16 14" aria-hidden>
          <path className="fill-white stroke-walnut-900" d="M8 0.8 15.3 13.2H0.7Z" strokeWidth="1.2" />
          <rect className="fill-walnut-900" x="7.2" y="4.5" width="1.6" height="4.6" />
          <rect className="fill-walnut-900" x="7.2" y="10.2" width="1.6" height="1.6" />
        </svg>
        {c.signal}
      </div>
      <p className="py-1 pr-2">
        <strong>{c.title}.</strong> {c.text} {extra ? <span>{extra} </span> : null}
        <span className="text-walnut-700">{DEFER}</span>
      </p>
    </div>
  );
}
