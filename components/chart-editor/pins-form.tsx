"use client";
// Pinning a pair for a range of rounds, under the round-by-round table: the maker chooses the part,
// rounds from–to and the two colours knitted there; the garment's round planner then keeps that
// pair in those rounds (any other colour there is darned). Pins are saved with the design version,
// in the first chart's options, like the editor's other chart options.
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { checkPins, pinParts } from "@/lib/core/design-garment";
import type { RoundPinInput, RoundReading } from "@/lib/core/garment";

export interface PinsFormProps {
  rounds: RoundReading[];
  pins: RoundPinInput[];
  palette: { key: string; name: string }[];
  /** the design's darned colours, worked out when a pin is added */
  darn: () => string[];
  onChange: (pins: RoundPinInput[]) => void;
  readOnly?: boolean;
}

export function PinsForm({ rounds, pins, palette, darn, onChange, readOnly }: PinsFormProps) {
  const parts = pinParts(rounds);
  const [part, setPart] = useState(parts[0]?.part ?? "");
  const [from, setFrom] = useState("1");
  const [to, setTo] = useState("1");
  const [a, setA] = useState(palette[0]?.key ?? "");
  const [b, setB] = useState(palette[1]?.key ?? "");
  const [problem, setProblem] = useState<string | null>(null);
  const name = (key: string) => palette.find((c) => c.key === key)?.name ?? key;
  const chosen = parts.find((p) => p.part === part) ?? parts[0];
  if (!chosen || palette.length < 2) return null;

  const add = () => {
    const pin: RoundPinInput = { part: chosen.part, fromRound: Number(from), toRound: Number(to), pair: [a, b] };
    const next = [...pins, pin];
    const problems = checkPins(next, { rounds, palette, darn: darn() });
    const mine = problems.find((p) => p.index === next.length - 1) ?? problems[0];
    if (mine) {
      setProblem(mine.index === next.length - 1 ? `Not pinned: ${mine.message}` : `Pin ${mine.index + 1}: ${mine.message}`);
      return;
    }
    setProblem(null);
    onChange(next);
  };

  return (
    <div className="mt-3 space-y-2" data-testid="pins-form">
      <h3 className="font-semibold">Pinned pairs</h3>
      {pins.length ? (
        <ul className="space-y-1 text-sm" data-testid="pins-list">
          {pins.map((p, i) => (
            <li key={`${p.part}-${p.fromRound}-${p.toRound}-${p.pair.join("")}`} className="flex flex-wrap items-center gap-2">
              <span>
                {p.part ?? parts[0]?.part}, rounds {p.fromRound === p.toRound ? p.fromRound : `${p.fromRound}–${p.toRound}`}: {name(p.pair[0])} and {name(p.pair[1])}
              </span>
              <Button
                variant="secondary"
                className="!px-2 !py-0.5 text-xs"
                disabled={readOnly}
                aria-label={`Remove the pin on rounds ${p.fromRound}–${p.toRound}`}
                onClick={() => {
                  setProblem(null);
                  onChange(pins.filter((_, k) => k !== i));
                }}
              >
                Remove
              </Button>
            </li>
          ))}
        </ul>
      ) : (
        <p className="text-sm text-bark">None: the plan chooses the pair of every round.</p>
      )}
      <fieldset className="flex flex-wrap items-end gap-2 text-sm" disabled={readOnly}>
        <legend className="sr-only">Pin a pair for a range of rounds</legend>
        {parts.length > 1 ? (
          <label className="flex flex-col">
            Part
            <select className="rounded-md border border-bark/40 px-2 py-1" value={chosen.part} onChange={(e) => setPart(e.target.value)}>
              {parts.map((p) => (
                <option key={p.part} value={p.part}>
                  {p.part} (rounds 1–{p.rounds})
                </option>
              ))}
            </select>
          </label>
        ) : null}
        <RoundField label="From round" max={chosen.rounds} value={from} onChange={setFrom} />
        <RoundField label="To round" max={chosen.rounds} value={to} onChange={setTo} />
        <ColourField label="First colour" palette={palette} value={a} onChange={setA} />
        <ColourField label="Second colour" palette={palette} value={b} onChange={setB} />
        <Button variant="secondary" className="!px-3 !py-1.5" onClick={add}>
          Pin this pair
        </Button>
      </fieldset>
      {problem ? (
        <p role="alert" className="text-sm font-semibold text-madder-dark" data-testid="pin-problem">
          {problem}
        </p>
      ) : null}
    </div>
  );
}

function RoundField({ label, max, value, onChange }: { label: string; max: number; value: string; onChange: (v: string) => void }) {
  return (
    <label className="flex flex-col">
      {label}
      <input className="w-20 rounded-md border border-bark/40 px-2 py-1" type="number" inputMode="numeric" min={1} max={max} value={value} onChange={(e) => onChange(e.target.value)} />
    </label>
  );
}

function ColourField({ label, palette, value, onChange }: { label: string; palette: { key: string; name: string }[]; value: string; onChange: (v: string) => void }) {
  return (
    <label className="flex flex-col">
      {label}
      <select className="rounded-md border border-bark/40 px-2 py-1" value={value} onChange={(e) => onChange(e.target.value)}>
        {palette.map((c) => (
          <option key={c.key} value={c.key}>
            {c.name}
          </option>
        ))}
      </select>
    </label>
  );
}
