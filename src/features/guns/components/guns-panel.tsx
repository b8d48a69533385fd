import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { TextField } from "@/components/ui/form/text-field";
import { toast } from "@/components/ui/toast/toast-store";
import { gunQueries, useCreateGun, useUpdateGun } from "../api/guns.queries";

/**
 * The shop's spray guns, named the way the painters know them. Coat logs and test panels say which gun was used;
 * a gun no longer in use is put away (never deleted, so old records still name it).
 */
export function GunsPanel() {
  const guns = useQuery(gunQueries.list());
  const create = useCreateGun();
  const update = useUpdateGun();
  const [name, setName] = useState("");
  const [description, setDescription] = useState("");
  const [problem, setProblem] = useState<{ message: string; fields: Record<string, string> } | null>(null);

  const add = async (e: React.FormEvent) => {
    e.preventDefault();
    setProblem(null);
    try {
      await create.mutateAsync({ name, description });
      toast.success(`${name} added`);
      setName("");
      setDescription("");
    } catch (error) {
      setProblem(isApiError(error) ? { message: error.message, fields: error.fields } : { message: "Not saved. Try again.", fields: {} });
    }
  };

  return (
    <Panel title="Spray guns" titleId="guns-heading">
      <p className="text-ink-950">Painters pick the gun when they log a coat or record a test panel.</p>
      {guns.error ? <Alert tone="error">{guns.error.message}</Alert> : null}
      <ul className="mt-3 flex flex-col divide-y divide-primer-200" aria-label="The shop's guns">
        {(guns.data ?? []).map((g) => (
          <li key={g.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              <span className="font-semibold">{g.name}</span>
              {g.description ? <span className="text-primer-800"> · {g.description}</span> : null}
              {g.active ? null : <span className="ml-2 rounded-full bg-primer-200 px-2 py-0.5 text-xs font-semibold">Put away</span>}
            </span>
            <Button
              variant="ghost"
              size="sm"
              disabled={update.isPending}
              onClick={() => update.mutate({ id: g.id, active: !g.active, version: g.version }, { onError: (err) => toast.error(err.message) })}
            >
              {g.active ? "Put away" : "Back in use"}
              <span className="sr-only"> {g.name}</span>
            </Button>
          </li>
        ))}
        {guns.data?.length === 0 ? <li className="py-2 text-primer-800">No guns yet.</li> : null}
      </ul>
      <form onSubmit={add} noValidate className="mt-4 grid gap-3 sm:grid-cols-[1fr_2fr_auto] sm:items-end">
        {problem && !problem.fields.name ? <Alert tone="error" className="sm:col-span-3">{problem.message}</Alert> : null}
        <TextField label="Gun name" placeholder="e.g. Gun 2 (candy)" value={name} error={problem?.fields.name} onChange={(e) => setName(e.target.value)} />
        <TextField label="Description" placeholder="e.g. HVLP, 1.3 mm tip" value={description} error={problem?.fields.description} onChange={(e) => setDescription(e.target.value)} />
        <Button type="submit" pending={create.isPending}>
          Add gun
        </Button>
      </form>
    </Panel>
  );
}
