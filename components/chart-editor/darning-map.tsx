"use client";
// One darned colour's route as a numbered stitch map: the needle's order, each strand's start (ring)
// and end (square), carries on the wrong side as dashed lines. Step through it or let it play.
import { useEffect, useMemo, useRef, useState } from "react";
import type { ChartV1 } from "@/lib/core/chart";
import type { ColourDarning } from "@/lib/core/colourwork/darn-colour";
import { Button } from "@/components/ui/button";

interface Step {
  row: number;
  stitch: number;
  carryCm: number;
  strand: number;
  first: boolean;
  last: boolean;
}

export function flattenRoute(colour: ColourDarning): Step[] {
  const out: Step[] = [];
  colour.strands.forEach((s, si) =>
    s.stitches.forEach((st, i) =>
      out.push({ row: st.row, stitch: st.stitch, carryCm: st.carryCm ?? 0, strand: si + 1, first: i === 0, last: i === s.stitches.length - 1 }),
    ),
  );
  return out;
}

/** How many steps the map shows when it opens: the whole first strand. */
export function firstStrandSteps(steps: { strand: number }[]): number {
  const n = steps.findIndex((s) => s.strand !== 1);
  return n < 0 ? steps.length : n;
}

const ZOOMS = [12, 16, 22, 30, 40];

export function DarningMap({ chart, colour }: { chart: ChartV1; colour: ColourDarning }) {
  const steps = useMemo(() => flattenRoute(colour), [colour]);
  // Opens on the first strand (not the whole route), large enough to read the step numbers.
  const [at, setAt] = useState(() => firstStrandSteps(steps));
  const [playing, setPlaying] = useState(false);
  const [zoomAt, setZoomAt] = useState(() => (chart.width > 60 ? 1 : 2));
  const view = useRef<HTMLDivElement>(null);

  useEffect(() => {
    if (!playing) return;
    if (at >= steps.length) {
      setPlaying(false);
      return;
    }
    const t = setTimeout(() => setAt((a) => a + 1), 250);
    return () => clearTimeout(t);
  }, [playing, at, steps.length]);

  const cell = ZOOMS[zoomAt];
  const rowH = Math.max(10, Math.round((cell * chart.gauge.stitchesPer10cm) / chart.gauge.rowsPer10cm));
  const w = chart.width * cell;
  const h = chart.height * rowH;
  const cx = (stitch: number) => (chart.width - stitch + 0.5) * cell;
  const cy = (row: number) => (chart.height - row + 0.5) * rowH;
  const hex = new Map(chart.palette.map((c) => [c.key, c.hex]));
  const shown = steps.slice(0, at);
  const now = shown[shown.length - 1];
  const font = Math.max(9, Math.min(16, Math.floor(Math.min(cell, rowH) * 0.6)));

  // Keep the current stitch (at first, the first strand's start) in view rather than an empty corner.
  const focus = now ?? steps[0];
  useEffect(() => {
    const box = view.current;
    if (!box || !focus) return;
    box.scrollLeft = Math.max(0, cx(focus.stitch) - box.clientWidth / 2);
    box.scrollTop = Math.max(0, cy(focus.row) - box.clientHeight / 2);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [focus?.stitch, focus?.row, cell, rowH]);

  return (
    <figure className="mt-2">
      <div className="flex flex-wrap items-center gap-2">
        <Button variant="secondary" className="!px-3 !py-1 text-sm" onClick={() => { setPlaying(false); setAt(0); }}>
          Start
        </Button>
        <Button variant="secondary" className="!px-3 !py-1 text-sm" onClick={() => { setPlaying(false); setAt((a) => Math.max(0, a - 1)); }}>
          Previous stitch
        </Button>
        <Button variant="secondary" className="!px-3 !py-1 text-sm" onClick={() => { setPlaying(false); setAt((a) => Math.min(steps.length, a + 1)); }}>
          Next stitch
        </Button>
        <Button variant="secondary" className="!px-3 !py-1 text-sm" aria-pressed={playing} onClick={() => { if (at >= steps.length) setAt(0); setPlaying((p) => !p); }}>
          {playing ? "Pause" : "Play"}
        </Button>
        <Button variant="secondary" className="!px-3 !py-1 text-sm" onClick={() => { setPlaying(false); setAt(steps.length); }}>
          Whole route
        </Button>
        <Button variant="secondary" className="!px-3 !py-1 text-sm" aria-label="Zoom the route map out" disabled={zoomAt === 0} onClick={() => setZoomAt((z) => Math.max(0, z - 1))}>
          −
        </Button>
        <Button variant="secondary" className="!px-3 !py-1 text-sm" aria-label="Zoom the route map in" disabled={zoomAt === ZOOMS.length - 1} onClick={() => setZoomAt((z) => Math.min(ZOOMS.length - 1, z + 1))}>
          +
        </Button>
        <p className="text-sm" aria-live="polite" data-testid="route-step">
          {now
            ? `Step ${at} of ${steps.length}: strand ${now.strand}, row ${now.row}, stitch ${now.stitch}${now.carryCm > 0 ? `, carried ${now.carryCm.toFixed(1)} cm` : ""}${now.first ? " (strand starts)" : ""}${now.last ? " (strand ends)" : ""}`
            : `${steps.length} stitches in ${colour.strands.length} strand${colour.strands.length === 1 ? "" : "s"}`}
        </p>
      </div>
      <div ref={view} className="mt-2 max-h-[32rem] overflow-auto rounded border border-bark/20 bg-white" tabIndex={0} aria-label={`Route map for ${colour.name}`}>
        <svg width={w} height={h} viewBox={`0 0 ${w} ${h}`} role="img" aria-label={`Darning route for ${colour.name}: ${colour.stitches} stitches, ${colour.strands.length} strands, ${colour.ends} ends, ${colour.carryCm} cm carried`}>
          {chart.rows.map((text, i) =>
            Array.from(text).map((k, x) => (
              <rect key={`${i}-${x}`} x={x * cell} y={i * rowH} width={cell} height={rowH} fill={hex.get(k) ?? "#fff"} opacity={k === colour.key ? 0.35 : 0.15} stroke="#CFC6B8" strokeWidth={0.5} />
            )),
          )}
          {shown.map((s, i) => {
            if (i === 0 || s.first) return null;
            const p = shown[i - 1];
            return <line key={`l${i}`} x1={cx(p.stitch)} y1={cy(p.row)} x2={cx(s.stitch)} y2={cy(s.row)} stroke="#3B2F26" strokeWidth={s.carryCm > 0 ? 1.5 : 1} strokeDasharray={s.carryCm > 0 ? "4 3" : undefined} />;
          })}
          {shown.map((s, i) => (
            <g key={`s${i}`}>
              {s.first ? <circle cx={cx(s.stitch)} cy={cy(s.row)} r={Math.min(cell, rowH) / 2 - 0.5} fill="none" stroke="#1B6E3A" strokeWidth={2} /> : null}
              {s.last ? <rect x={cx(s.stitch) - cell / 2 + 1} y={cy(s.row) - rowH / 2 + 1} width={cell - 2} height={rowH - 2} fill="none" stroke="#A8322D" strokeWidth={2} /> : null}
              <text x={cx(s.stitch)} y={cy(s.row)} fontSize={font} textAnchor="middle" dominantBaseline="central" fill={i === at - 1 ? "#0B5FFF" : "#1B1B1B"} fontWeight={i === at - 1 ? 700 : 600} stroke="#FFFFFF" strokeWidth={3} paintOrder="stroke" strokeLinejoin="round">
                {i + 1}
              </text>
            </g>
          ))}
        </svg>
      </div>
      <figcaption className="mt-1 text-sm text-bark">
        Numbers are the order of the needle. A ring marks where a strand starts, a square where it ends; dashed lines are yarn carried on the wrong side, solid lines
        step to a neighbouring stitch. {colour.name}: {colour.strands.length} strand{colour.strands.length === 1 ? "" : "s"}, {colour.ends} ends, {colour.carryCm} cm carried,{" "}
        {Math.round(colour.yarnCm)} cm of yarn.
      </figcaption>
    </figure>
  );
}
