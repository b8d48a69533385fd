import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { TextField } from "@/components/ui/form/text-field";
import { toast } from "@/components/ui/toast/toast-store";
import { scheduleQueries, useCreateBooth, useUpdateBooth } from "../api/schedule.queries";

const DAYS = ["Sun", "Mon", "Tue", "Wed", "Thu", "Fri", "Sat"];
const browserZone = () => Intl.DateTimeFormat().resolvedOptions().timeZone;

/** The shop's spray booths and their hours, for the booth schedule. The owner keeps them. */
export function BoothsPanel() {
  const booths = useQuery(scheduleQueries.booths());
  const create = useCreateBooth();
  const update = useUpdateBooth();
  const [form, setForm] = useState({ name: "", opensAt: "07:00", closesAt: "17:00", setupMinutes: "20", canCureOutside: false });
  const [problem, setProblem] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const add = async (e: React.FormEvent) => {
    e.preventDefault();
    setProblem(null);
    try {
      await create.mutateAsync({ ...form, setupMinutes: form.setupMinutes, timeZone: browserZone() });
      toast.success(`${form.name} added`);
      setForm({ ...form, name: "" });
    } catch (error) {
      setProblem(isApiError(error) ? { message: error.message, fields: error.fields } : { message: "Not saved. Try again.", fields: {} });
    }
  };
  return (
    <Panel title="Spray booths" titleId="booths-heading">
      <p className="text-ink-950">The booth schedule books each job's layers into these booths, within their hours.</p>
      {booths.error ? <Alert tone="error">{booths.error.message}</Alert> : null}
      <ul className="mt-3 flex flex-col divide-y divide-primer-200" aria-label="The shop's booths">
        {(booths.data ?? []).map((b) => (
          <li key={b.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <span className="font-semibold">{b.name}</span>
              <span className="text-primer-800">
                {" "}
                · {b.workDays.map((d) => DAYS[d]).join(", ")} {b.opensAt}–{b.closesAt} · set-up {b.setupMinutes} min · {b.canCureOutside ? "parts cure outside" : "parts cure in the booth"}
              </span>
              {b.active ? null : <span className="ml-2 rounded-full bg-primer-200 px-2 py-0.5 text-xs font-semibold">Not in use</span>}
            </span>
            <Button variant="ghost" size="sm" disabled={update.isPending} onClick={() => update.mutate({ id: b.id, active: !b.active, version: b.version }, { onError: (err) => toast.error(err.message) })}>
              {b.active ? "Take out of use" : "Back in use"}
              <span className="sr-only"> {b.name}</span>
            </Button>
          </li>
        ))}
        {booths.data?.length === 0 ? <li className="py-2 text-primer-800">No booths yet.</li> : null}
      </ul>
      <form onSubmit={add} noValidate className="mt-4 grid gap-3 sm:grid-cols-3 sm:items-end">
        {problem && !Object.keys(problem.fields).length ? <Alert tone="error" className="sm:col-span-3">{problem.message}</Alert> : null}
        <TextField label="Booth name" placeholder="e.g. Downdraft booth" value={form.name} error={problem?.fields.name} onChange={(e) => setForm({ ...form, name: e.target.value })} />
        <TextField label="Opens" type="time" value={form.opensAt} error={problem?.fields.opensAt} onChange={(e) => setForm({ ...form, opensAt: e.target.value })} />
        <TextField label="Closes" type="time" value={form.closesAt} error={problem?.fields.closesAt} onChange={(e) => setForm({ ...form, closesAt: e.target.value })} />
        <TextField label="Set-up minutes" inputMode="numeric" value={form.setupMinutes} error={problem?.fields.setupMinutes} onChange={(e) => setForm({ ...form, setupMinutes: e.target.value })} />
        <label className="flex min-h-11 items-center gap-2">
          <input type="checkbox" checked={form.canCureOutside} onChange={(e) => setForm({ ...form, canCureOutside: e.target.checked })} className="size-5" />
          Parts can cure outside it
        </label>
        <Button type="submit" pending={create.isPending}>
          Add booth
        </Button>
      </form>
    </Panel>
  );
}
