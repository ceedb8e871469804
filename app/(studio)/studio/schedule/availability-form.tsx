"use client";
import { useActionState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { idleState, type ActionState } from "@/lib/action-state";
import { WORK_STAGE_LABELS, WORK_STAGES } from "@/lib/schemas/production";
import { saveAvailabilityAction } from "./actions";

const DAYS = [
  ["mon", "Monday"],
  ["tue", "Tuesday"],
  ["wed", "Wednesday"],
  ["thu", "Thursday"],
  ["fri", "Friday"],
  ["sat", "Saturday"],
  ["sun", "Sunday"],
] as const;

export function AvailabilityForm({
  studioId,
  member,
}: {
  studioId: string;
  member: { memberId: string; name: string; weekdayMinutes: number[]; daysOff: string[]; stages: string[] };
}) {
  const [state, action, pending] = useActionState<ActionState<{ weekdayMinutes: number[] }>, FormData>(saveAvailabilityAction, idleState);
  const v = state.status === "error" ? state.values : undefined;
  const fe = state.status === "error" ? state.fieldErrors : undefined;
  return (
    <form action={action} className="flex flex-col gap-3" aria-label={`Availability of ${member.name}`}>
      <input type="hidden" name="memberId" value={member.memberId} />
      <input type="hidden" name="studioId" value={studioId} />
      {state.status === "error" ? <Notice tone="error">{state.message}</Notice> : null}
      {state.status === "ok" ? <Notice tone="success">{state.message}</Notice> : null}
      <fieldset>
        <legend className="mb-1 font-semibold">Hours each weekday</legend>
        <div className="grid grid-cols-4 gap-2 sm:grid-cols-7">
          {DAYS.map(([key, label], i) => (
            <Field
              key={key}
              name={key}
              label={label}
              inputMode="decimal"
              className="text-sm"
              defaultValue={v?.[key] ?? String(Math.round((member.weekdayMinutes[i] / 60) * 100) / 100)}
              errors={fe?.[key] ?? fe?.[`weekdayMinutes.${i}`]}
            />
          ))}
        </div>
      </fieldset>
      <Field
        name="daysOff"
        label="Days off"
        hint="Dates like 2026-12-24, separated by spaces or commas."
        defaultValue={v?.daysOff ?? member.daysOff.join(" ")}
        errors={fe?.daysOff}
      />
      <fieldset>
        <legend className="font-semibold">Stages this person works on</legend>
        <p className="text-sm text-bark">None ticked means every stage.</p>
        <div className="mt-1 flex flex-wrap gap-4">
          {WORK_STAGES.map((s) => (
            <label key={s} className="flex items-center gap-2">
              <input type="checkbox" name={`stage_${s}`} defaultChecked={member.stages.includes(s)} />
              {WORK_STAGE_LABELS[s]}
            </label>
          ))}
        </div>
      </fieldset>
      <div>
        <Button type="submit" disabled={pending}>
          Save availability
        </Button>
      </div>
    </form>
  );
}
