import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import type { BoothDto, SchedulableJobDto } from "@shared/schemas/schedule.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/form/select-field";
import { TextField } from "@/components/ui/form/text-field";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { formatDate } from "@/utils/format-date";
import { scheduleQueries, useBookSession, useSetPrepPlan } from "../api/schedule.queries";
import { fromLocalInput, toLocalInput, whenText } from "./schedule-range";

/** Jobs that still need booth time: when their prep is ready, and a form to book each layer not yet booked. */
export function JobsToBook() {
  const jobs = useQuery(scheduleQueries.jobs());
  const booths = useQuery(scheduleQueries.booths());
  if (jobs.isPending || booths.isPending) return <Spinner label="Loading jobs to book…" />;
  if (jobs.error) return <Alert tone="error">{jobs.error.message}</Alert>;
  const active = (booths.data ?? []).filter((b) => b.active);
  const open = jobs.data.filter((j) => j.layers.length > 0);
  return (
    <section aria-labelledby="jobs-to-book-heading" className="flex flex-col gap-3">
      <h2 id="jobs-to-book-heading" className="text-xl font-semibold">
        Jobs needing booth time
      </h2>
      {open.length === 0 ? <p className="text-primer-800">Every job in the shop has its layers booked or sprayed.</p> : null}
      <ul className="grid gap-3 lg:grid-cols-2">
        {open.map((j) => (
          <li key={j.id}>
            <JobCard job={j} booths={active} />
          </li>
        ))}
      </ul>
    </section>
  );
}

function JobCard({ job, booths }: { job: SchedulableJobDto; booths: BoothDto[] }) {
  const setPrep = useSetPrepPlan();
  const book = useBookSession();
  const unbooked = job.layers.filter((l) => !l.scheduled);
  const [prepAt, setPrepAt] = useState(job.prepReadyAt ? toLocalInput(Date.parse(job.prepReadyAt)) : "");
  const [layerId, setLayerId] = useState(String(unbooked[0]?.id ?? ""));
  const [boothId, setBoothId] = useState(String(booths[0]?.id ?? ""));
  const [startsAt, setStartsAt] = useState("");
  const [fields, setFields] = useState<Record<string, string>>({});

  const savePrep = async () => {
    const ms = fromLocalInput(prepAt);
    try {
      await setPrep.mutateAsync({ jobId: job.id, readyAt: Number.isNaN(ms) ? null : new Date(ms).toISOString() });
      toast.success(Number.isNaN(ms) ? "Prep date cleared" : `Prep ready by ${whenText(ms)}`);
    } catch (err) {
      toast.error(isApiError(err) ? err.message : "Not saved");
    }
  };
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setFields({});
    const ms = fromLocalInput(startsAt);
    if (Number.isNaN(ms)) return setFields({ startsAt: "Pick a day and time" });
    try {
      const res = await book.mutateAsync({ jobId: job.id, layerId: Number(layerId), boothId: Number(boothId), startsAt: new Date(ms).toISOString() });
      const mine = res.conflicts.filter((c) => c.jobId === job.id).length;
      toast.success(mine ? `Booked, with ${mine} conflict${mine === 1 ? "" : "s"} to look at` : "Booked");
      setStartsAt("");
    } catch (err) {
      if (isApiError(err)) setFields(Object.keys(err.fields).length ? err.fields : { startsAt: err.message });
      else toast.error("Not booked");
    }
  };

  return (
    <article aria-labelledby={`book-job-${job.id}`} className="flex flex-col gap-3 rounded-xl border border-primer-300 bg-white p-4">
      <header>
        <h3 id={`book-job-${job.id}`} className="text-lg font-semibold">
          {job.title}
        </h3>
        <p className="text-sm text-primer-800">
          #{job.id}
          {job.dueDate ? ` · due ${formatDate(job.dueDate)}` : " · no due date"} · layers:{" "}
          {job.layers.map((l) => `${l.name}${l.scheduled ? " (booked)" : ""}`).join(", ")}
        </p>
      </header>
      {job.prepSignedOff ? (
        <p className="text-sm">Prep signed off {job.prepReadyAt ? whenText(Date.parse(job.prepReadyAt)) : ""}.</p>
      ) : (
        <div className="flex flex-wrap items-end gap-2">
          <TextField label="Prep ready by" type="datetime-local" value={prepAt} onChange={(e) => setPrepAt(e.target.value)} fieldClassName="min-w-56" />
          <Button variant="secondary" onClick={savePrep} pending={setPrep.isPending}>
            Save prep date<span className="sr-only"> for {job.title}</span>
          </Button>
        </div>
      )}
      {unbooked.length > 0 && booths.length > 0 ? (
        <form onSubmit={submit} noValidate className="grid gap-2 sm:grid-cols-2">
          <SelectField label="Layer" value={layerId} onChange={(e) => setLayerId(e.target.value)} error={fields.layerId}>
            {unbooked.map((l) => (
              <option key={l.id} value={l.id}>
                {l.name}
              </option>
            ))}
          </SelectField>
          <SelectField label="Booth" value={boothId} onChange={(e) => setBoothId(e.target.value)} error={fields.boothId}>
            {booths.map((b) => (
              <option key={b.id} value={b.id}>
                {b.name}
              </option>
            ))}
          </SelectField>
          <TextField label="Starts" type="datetime-local" value={startsAt} onChange={(e) => setStartsAt(e.target.value)} error={fields.startsAt} />
          <div className="flex items-end">
            <Button type="submit" pending={book.isPending}>
              Book<span className="sr-only"> a layer of {job.title}</span>
            </Button>
          </div>
        </form>
      ) : null}
    </article>
  );
}
