import { CHANGE_WAITING } from "@shared/domain/change-orders";
import { switchTemperatureText } from "@shared/domain/temperature";
import { useEffect, useState, type ChangeEvent, type FormEvent } from "react";
import { Link } from "react-router";
import { CheckCircle2, PaintBucket, TriangleAlert } from "lucide-react";
import { LAYER_KIND_LABELS } from "@shared/domain/layers";
import { vocWarning } from "@shared/domain/voc-limits";
import type { BoothDto } from "@shared/schemas/booth.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { TextField } from "@/components/ui/form/text-field";
import { SafetyCautions } from "@/components/ui/safety-cautions";
import { cn } from "@/utils/cn";
import { PhotoUploadButton } from "@/features/uploads/components/photo-upload-button";
import { useLogCoat } from "../api/booth.queries";
import { isWaiting, waitingCoats } from "../api/waiting";
import { useOfflineQueue } from "@/lib/offline/use-offline";
import { useLogCoatForm, type LogFields } from "../hooks/use-log-coat-form";
import { formatMinutes } from "@shared/domain/duration";
import { useShopUnits } from "@/lib/shop-settings.queries";
import { formatPressure } from "@/utils/format-measure";
import { ConditionInput } from "./condition-input";
import { setupPrefill, SpraySetupPanel } from "./spray-setup-fields";
import { formatClock, PotLifeTimer, StepTimer } from "./booth-timers";
import { breachesAt, TimingWindowTimers } from "./timing-windows";


/** The top of the booth card: what to spray next in large type, its timers and cautions, and the one-tap log. */
export function NextStepPanel({ card, now, clockOffset, prepPath }: { card: BoothDto; now: number; clockOffset: number; prepPath: string }) {
  const next = card.next;
  const current = next.state === "spray" ? card.layers.find((l) => l.id === next.layerId) : undefined;
  const units = useShopUnits();

  if (next.state === "no_plan" || next.state === "no_layers") {
    return (
      <section aria-labelledby="next-step-heading" className="rounded-2xl border-2 border-ink-800 bg-white p-5 shadow-card">
        <h2 id="next-step-heading" className="text-3xl font-bold text-ink-950">
          {next.state === "no_plan" ? "No finish plan yet" : "The plan has no layers"}
        </h2>
        <p className="mt-2 text-lg text-primer-800">The office adds the finish plan before the job comes to the booth.</p>
      </section>
    );
  }

  if (next.state === "done") {
    return (
      <section aria-labelledby="next-step-heading" className="rounded-2xl border-2 border-emerald-700 bg-emerald-50 p-5 shadow-card">
        <h2 id="next-step-heading" className="flex items-center gap-3 text-3xl font-bold text-emerald-950 sm:text-4xl">
          <CheckCircle2 aria-hidden className="size-9 shrink-0" />
          Every coat is logged
        </h2>
        <p className="mt-2 text-lg text-emerald-950">Last coat at {formatClock(next.lastCoatAt)}. The job is curing.</p>
        <div className="mt-4 max-w-xl">
          <StepTimer timer={next.timer} now={now} nextLabel="the finish can be handled" />
        </div>
      </section>
    );
  }

  const nextLabel = `coat ${next.coat} of ${next.layerName}`;
  const batch = card.openBatch;
  return (
    <section aria-labelledby="next-step-heading" className="@container/next rounded-2xl border-2 border-ink-900 bg-white shadow-raised">
      <div className="rounded-t-2xl bg-ink-950 px-5 py-4 text-white @[52rem]/next:flex @[52rem]/next:items-end @[52rem]/next:gap-8">
        <div>
          <h2 id="next-step-heading" className="text-sm font-semibold tracking-wide text-ink-100 uppercase">
            Next step
          </h2>
          <p className="mt-1 text-5xl leading-none font-bold tracking-tight whitespace-nowrap sm:text-6xl" data-testid="next-coat" aria-live="polite">
            Coat {next.coat} of {next.of}
          </p>
        </div>
        <div className="min-w-0">
          <p className="mt-2 text-3xl font-semibold sm:text-4xl" data-testid="next-layer">
            {next.layerName}
          </p>
          <p className="mt-1 text-lg text-ink-100">
            {current
              ? [
                  next.layerName.toLowerCase() !== LAYER_KIND_LABELS[next.layerKind].toLowerCase() && LAYER_KIND_LABELS[next.layerKind],
                  current.gunTip && `tip ${current.gunTip}`,
                  current.pressurePsi != null && formatPressure(current.pressurePsi, units.pressure),
                  current.overlapPct != null && `${current.overlapPct}% overlap`,
                  `flash ${formatMinutes(current.flashMinutes)}`,
                ]
                  .filter(Boolean)
                  .join(" · ")
              : null}
          </p>
        </div>
      </div>
      <div className="flex flex-col gap-4 p-4 sm:p-5">
        {/* Wide cards (landscape) put the cautions beside the timers, so the log button stays on screen. */}
        <div className="grid gap-4 @[52rem]/next:grid-cols-2">
          {current && current.cautions.length > 0 ? (
            <div data-booth-cautions>
              <SafetyCautions cautions={current.cautions} className="text-base" />
            </div>
          ) : null}
          <div className="flex flex-col gap-3">
            <div className={cn("grid gap-3", batch ? "@[40rem]/next:grid-cols-2 @[52rem]/next:grid-cols-1" : "")}>
              <StepTimer timer={next.timer} now={now} nextLabel={nextLabel} />
              {batch ? <PotLifeTimer endsAt={batch.potLifeEndsAt} mixedAt={batch.mixedAt} now={now} /> : null}
              <TimingWindowTimers card={card} now={now} />
            </div>
            {current?.vocOverLimit && current.vocGPerL != null && current.vocLimitGPerL != null ? (
              <Alert tone="error" title="VOC over the shop's limit">
                {vocWarning(current.kind, current.vocGPerL, current.vocLimitGPerL)}
              </Alert>
            ) : null}
            {!batch && current && current.components.length > 0 ? (
              <Alert tone="warning" title="No batch recorded as mixed for this layer">
                Mix it from the mix sheet first, so the pot life is timed and the batch is on the record.
              </Alert>
            ) : null}
          </div>
        </div>
        {card.canLog ? (
          <LogCoatForm key={`${next.layerId}-${next.coat}`} card={card} now={now} clockOffset={clockOffset} prepPath={prepPath} />
        ) : (
          <Alert tone="info" title="Read only">
            Coats are logged by the job&apos;s painter or the owner.
          </Alert>
        )}
      </div>
    </section>
  );
}

/** After a tap, the next coat's button waits this long: a double tap (gloves, a sticky screen) is one coat, not two. */
const TAP_GUARD_MS = 1500;
let lastTapAt = 0;

function LogCoatForm({ card, now, clockOffset, prepPath }: { card: BoothDto; now: number; clockOffset: number; prepPath: string }) {
  const next = card.next;
  if (next.state !== "spray") throw new Error("LogCoatForm needs a coat to log");
  const log = useLogCoat(card, clockOffset);
  const [guarded, setGuarded] = useState(() => Date.now() - lastTapAt < TAP_GUARD_MS);
  useEffect(() => {
    if (!guarded) return;
    const id = window.setTimeout(() => setGuarded(false), Math.max(0, TAP_GUARD_MS - (Date.now() - lastTapAt)));
    return () => window.clearTimeout(id);
  }, [guarded]);
  const [problem, setProblem] = useState<string | null>(null);
  const needsOverride = next.isFirstCoatOfJob && !card.prepReady;
  const [overriding, setOverriding] = useState(false);
  // Too early (flash, dry, induction), too late (recoat window) or no 2K batch: the painter waits, or says why not.
  const breaches = breachesAt(card, now);
  const [overridingTiming, setOverridingTiming] = useState(false);
  // A change order the customer has not approved holds this layer: only the owner goes ahead, with a reason.
  const changeHeld = card.layers.find((l) => l.id === next.layerId)?.changeWaiting ?? false;
  const [overridingChange, setOverridingChange] = useState(false);
  const [noting, setNoting] = useState(false);
  const last = card.lastConditions;
  const units = useShopUnits();
  const [setup] = useState(() => setupPrefill(card, next.layerId, next.layerKind, units.pressure));
  const form = useLogCoatForm(
    { jobId: card.job.id, layerId: next.layerId, coatNumber: next.coat },
    {
      boothTemp: last?.boothTemp != null ? String(last.boothTemp) : "",
      tempUnit: last?.tempUnit ?? units.temperature,
      humidityPct: last?.humidityPct != null ? String(last.humidityPct) : "",
      note: "",
      prepOverrideReason: "",
      timingOverrideReason: "",
      changeOverrideReason: "",
      ...setup.fields,
    },
  );
  const { values, errors, set } = form;
  const [submitting, setSubmitting] = useState(false);

  // Conditions carry over from the latest entry when the card refreshes: only a new latest entry fills the field
  // (not the painter clearing it), so it is adjusted while rendering when `last` changes, as React's docs advise.
  const [seenLast, setSeenLast] = useState(last);
  if (seenLast !== last) {
    setSeenLast(last);
    if (last?.boothTemp != null && values.boothTemp === "") set("boothTemp", String(last.boothTemp));
  }

  const step = (field: "boothTemp" | "humidityPct", delta: number, fallback: number) => {
    const raw = Number(values[field]);
    const value = Number.isFinite(raw) && values[field].trim() !== "" ? raw + delta : fallback;
    set(field, String(Math.round(value * 10) / 10));
  };

  const submit = async (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    if (submitting || guarded) return;
    setProblem(null);
    // Held from the tap itself (checking the form may wait for its schema to load): a second tap is not a second coat.
    setSubmitting(true);
    try {
      const parsed = await form.validate();
      if (!parsed) return;
      // Offline there is no server to refuse the tap: the tablet asks for the reason against a timing rule itself.
      if (!navigator.onLine && breaches.length && !(overridingTiming && parsed.timingOverrideReason)) {
        setOverridingTiming(true);
        setProblem(`Not logged: ${breaches.map((b) => b.message).join(" ")} Give a reason to go ahead.`);
        return;
      }
      const { jobId: _jobId, ...rest } = parsed;
      // No toast here: it would cover the log button. The "last logged" line below the button confirms it.
      await log.mutateAsync({
        ...rest,
        prepOverrideReason: needsOverride ? rest.prepOverrideReason : undefined,
        timingOverrideReason: overridingTiming ? rest.timingOverrideReason : undefined,
        changeOverrideReason: overridingChange ? rest.changeOverrideReason : undefined,
      });
      lastTapAt = Date.now();
      set("note", "");
      setNoting(false);
    } catch (error) {
      if (isApiError(error) && error.fields.prepOverrideReason) setOverriding(true);
      if (isApiError(error) && error.fields.timingOverrideReason) setOverridingTiming(true);
      if (isApiError(error) && error.fields.changeOverrideReason && card.canOverrideChange) setOverridingChange(true);
      setProblem(form.showServerErrors(error));
    } finally {
      setSubmitting(false);
    }
  };
  const field = <K extends "boothTemp" | "humidityPct" | "note" | "prepOverrideReason" | "timingOverrideReason" | "changeOverrideReason">(name: K) => ({
    name,
    value: values[name],
    onChange: (e: ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) => set(name, e.target.value),
  });

  const blocked = needsOverride && !overriding;
  return (
    <form ref={form.formRef} onSubmit={submit} noValidate className="@container flex flex-col gap-4" aria-label="Log a coat">
      {problem ? <Alert tone="error">{problem}</Alert> : null}
      {changeHeld ? (
        <Alert tone="warning" title={CHANGE_WAITING}>
          <p>{next.layerName} waits until the customer approves the change. {card.canOverrideChange ? "As the owner you can go ahead with a reason; it is kept on the record." : "Ask the owner or the office."}</p>
          {card.canOverrideChange && !overridingChange ? (
            <Button variant="secondary" size="lg" className="mt-3" icon={<TriangleAlert aria-hidden className="size-5" />} onClick={() => setOverridingChange(true)}>
              Go ahead anyway…
            </Button>
          ) : null}
        </Alert>
      ) : null}
      {overridingChange ? (
        <TextareaField label="Reason for spraying before the customer approves the change" required rows={2} className="text-lg" error={errors.changeOverrideReason} {...field("changeOverrideReason")} />
      ) : null}
      {needsOverride ? (
        <Alert tone="warning" title="Prep is not signed off">
          <p>
            {card.items
              .filter((i) => i.prepStatus !== "signed_off")
              .map((i) => i.name)
              .join(", ")}{" "}
            {card.items.filter((i) => i.prepStatus !== "signed_off").length === 1 ? "has" : "have"} no prep sign-off.{" "}
            <Link to={prepPath} className="font-semibold underline underline-offset-2">
              Open the prep records
            </Link>
            .
          </p>
          {!overriding ? (
            <Button variant="secondary" size="lg" className="mt-3" icon={<TriangleAlert aria-hidden className="size-5" />} onClick={() => setOverriding(true)}>
              Spray before sign-off…
            </Button>
          ) : null}
        </Alert>
      ) : null}
      {needsOverride && overriding ? (
        <TextareaField
          label="Reason for spraying before prep sign-off"
          hint="Kept on the job's record and shown to the office."
          required
          rows={2}
          className="text-lg"
          error={errors.prepOverrideReason}
          {...field("prepOverrideReason")}
        />
      ) : null}
      {breaches.length > 0 ? (
        <Alert tone="warning" title={breaches.length === 1 ? "Not yet: a timing rule" : "Not yet: timing rules"}>
          <ul className="flex flex-col gap-1 text-base" aria-label="Timing rules the next coat would break">
            {breaches.map((b) => (
              <li key={b.rule}>{b.message}.</li>
            ))}
          </ul>
          {!overridingTiming ? (
            <Button variant="secondary" size="lg" className="mt-3" icon={<TriangleAlert aria-hidden className="size-5" />} onClick={() => setOverridingTiming(true)}>
              Spray anyway…
            </Button>
          ) : null}
        </Alert>
      ) : null}
      {overridingTiming ? (
        <TextareaField
          label="Reason for going ahead against the timing rule"
          hint="Kept on the coat's record, flagged on the job page and the finish record."
          required
          rows={2}
          className="text-lg"
          error={errors.timingOverrideReason}
          {...field("timingOverrideReason")}
        />
      ) : null}
      <div className="grid gap-4 @[44rem]:grid-cols-2">
        <div className="flex flex-col gap-2">
          <ConditionInput
            label="Booth temperature"
            suffix=""
            error={errors.boothTemp ?? errors.tempUnit}
            onStep={(d) => step("boothTemp", d, values.tempUnit === "F" ? 70 : 21)}
            labelAside={
              <fieldset className="flex gap-1.5">
                <legend className="sr-only">Temperature unit</legend>
                {(["C", "F"] as const).map((u) => (
                  <label
                    key={u}
                    className={cn(
                      "grid min-h-12 w-14 cursor-pointer place-items-center rounded-lg border-2 text-base font-semibold has-focus-visible:outline-3 has-focus-visible:outline-offset-2 has-focus-visible:outline-candy-600",
                      values.tempUnit === u ? "border-ink-900 bg-ink-900 text-white" : "border-primer-400 bg-white text-ink-950",
                    )}
                  >
                    <input type="radio" name="tempUnit" value={u} className="sr-only" checked={values.tempUnit === u} onChange={() => {
                        set("boothTemp", switchTemperatureText(values.boothTemp, values.tempUnit, u));
                        set("tempUnit", u);
                      }}
                    />
                    °{u}
                  </label>
                ))}
              </fieldset>
            }
            {...field("boothTemp")}
          />
        </div>
        <ConditionInput label="Humidity" suffix="%" error={errors.humidityPct} onStep={(d) => step("humidityPct", d, 50)} {...field("humidityPct")} />
      </div>
      <SpraySetupPanel guns={card.guns} target={setup.target} values={values} errors={errors} set={(f, v) => set(f, v as LogFields[typeof f])} />
      {noting || errors.note ? (
        <TextField label="Note (optional)" placeholder="e.g. light orange peel on the left side" className="min-h-12 text-lg" error={errors.note} autoFocus {...field("note")} />
      ) : (
        <Button variant="ghost" size="lg" className="self-start" onClick={() => setNoting(true)}>
          + Add a note to this coat
        </Button>
      )}
      <Button
        type="submit"
        size="lg"
        block
        pending={submitting}
        disabled={blocked || guarded}
        icon={<PaintBucket aria-hidden className="size-7" />}
        className="min-h-20 rounded-2xl text-2xl"
      >
        Log coat {next.coat} of {next.of}
      </Button>
      <LastLogged card={card} clockOffset={clockOffset} />
    </form>
  );
}

/** Confirms the latest tap from the stored log (so it is still there after a reload). */
function LastLogged({ card, clockOffset }: { card: BoothDto; clockOffset: number }) {
  const last = card.coatLogs.filter((c) => c.status === "counts" || c.status === "corrected").at(-1);
  const queue = useOfflineQueue();
  // A coat still waiting on this tablet has no id yet: its photo waits for it in the queue (the card shows the entries
  // on their first try as not yet logged, so they are left out here as there).
  const waitsFor = last && isWaiting(last) ? waitingCoats(queue.entries.filter((e) => e.key !== queue.firstTry), card.job.id)[-last.id - 1]?.key : undefined;
  return (
    <div className="flex flex-col items-center gap-2">
    <p role="status" className="text-center text-base text-ink-950">
      {last ? (
        <>
          <CheckCircle2 aria-hidden className="mr-1.5 inline size-5 align-text-bottom text-emerald-700" />
          Last logged: coat {last.coatNumber} of {last.layerName} at {formatClock(last.at)}
          {isWaiting(last) ? " (on this tablet, waiting to send)" : last.painterName ? ` by ${last.painterName}` : ""}.
        </>
      ) : (
        "The time and your name are recorded by the server when you tap."
      )}
    </p>
    {last && (!isWaiting(last) || waitsFor) ? (
      <PhotoUploadButton
        owner={{ ownerType: "coat_log", ownerId: last.id }}
        label="Photo of this coat"
        queue={{ jobId: card.job.id, label: `Photo of coat ${last.coatNumber} of ${last.layerName}`, clockOffsetMs: clockOffset, waitsFor }}
      />
    ) : null}
    </div>
  );
}
