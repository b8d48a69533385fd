import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { useNavigate } from "react-router";
import type { RepeatFinishDto } from "@shared/schemas/finish-record.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { SearchPicker } from "@/components/ui/form/search-picker";
import { TextField } from "@/components/ui/form/text-field";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { customerQueries } from "@/features/customers/api/customers.queries";
import { useRepeatFinish } from "../api/finish-record.queries";

/**
 * Starts a new job that repeats a recorded finish: same items, and the plan as it was really sprayed (coats and gun
 * set-up). Lots that are used up are listed afterwards: a new lot of a toner can shift the colour.
 */
export function RepeatFinishDialog({
  from,
  defaultCustomerId,
  defaultTitle,
  onClose,
}: {
  from: { jobId: number } | { panelId: number };
  defaultCustomerId: number | null;
  defaultTitle: string;
  onClose: () => void;
}) {
  const current = useQuery({ ...customerQueries.detail(defaultCustomerId ?? 0), enabled: defaultCustomerId != null });
  const repeat = useRepeatFinish(from);
  const navigate = useNavigate();
  const [customerId, setCustomerId] = useState(defaultCustomerId ? String(defaultCustomerId) : "");
  const [customerName, setCustomerName] = useState<string | null>(null);
  const [title, setTitle] = useState(defaultTitle);
  const [problem, setProblem] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const [done, setDone] = useState<RepeatFinishDto | null>(null);

  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setProblem(null);
    try {
      const out = await repeat.mutateAsync({ customerId: customerId ? Number(customerId) : undefined, title: title.trim() || undefined });
      if (out.usedUpLots.length === 0) {
        toast.success("New job started from the recorded finish");
        navigate(paths.job(out.id));
        return;
      }
      setDone(out);
    } catch (error) {
      setProblem(isApiError(error) ? { message: error.message, fields: error.fields } : { message: "The job could not be started. Try again.", fields: {} });
    }
  };

  if (done)
    return (
      <Dialog title="New job started" onClose={() => navigate(paths.job(done.id))}>
        <Alert tone="warning" title="Some lots used last time are gone">
          <ul className="list-disc pl-5">
            {done.usedUpLots.map((l) => (
              <li key={`${l.materialCode}-${l.lotNumber}`}>
                {l.materialCode} {l.materialName}, lot {l.lotNumber}
              </li>
            ))}
          </ul>
          <p className="mt-2">A new lot of a toner or ground can differ: spray a test panel and compare it with the approved colour before the job.</p>
        </Alert>
        <FormActions>
          <Button size="lg" onClick={() => navigate(paths.job(done.id))}>
            Open the new job
          </Button>
        </FormActions>
      </Dialog>
    );

  return (
    <Dialog title="Repeat this finish" description="A new job with the same items and the plan as it was really sprayed." onClose={onClose}>
      <form onSubmit={submit} noValidate className="flex flex-col gap-4">
        {problem ? <Alert tone="error">{problem.message}</Alert> : null}
        <SearchPicker
          label="Customer"
          required
          noun="customers"
          placeholder="Type a name, e-mail or phone…"
          value={customerId}
          valueName={customerName ?? (customerId && customerId === String(defaultCustomerId) ? (current.data?.name ?? "…") : null)}
          onChange={(id, name) => {
            setCustomerId(id);
            setCustomerName(name);
          }}
          queryFor={customerQueries.search}
          error={problem?.fields.customerId}
        />
        <TextField label="Title of the new job" value={title} error={problem?.fields.title} onChange={(e) => setTitle(e.target.value)} />
        <FormActions>
          <Button type="submit" size="lg" pending={repeat.isPending} disabled={!customerId}>
            Start the new job
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </FormActions>
      </form>
    </Dialog>
  );
}
