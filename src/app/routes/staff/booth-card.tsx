import { useQuery } from "@tanstack/react-query";
import { useParams } from "react-router";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { boothQueries } from "@/features/booth/api/booth.queries";
import { BoothCard } from "@/features/booth/components/booth-card";
import type { RouteModule } from "@/app/router";
import { InPageNotFound } from "../in-page-not-found";

const jobIdOf = (param: string | undefined) => {
  const id = Number(param);
  return Number.isInteger(id) && id > 0 ? id : null;
};

/** The card starts loading with the screen's code. */
export const prefetch: RouteModule["prefetch"] = (queryClient, { params }) => {
  const id = jobIdOf(params.jobId);
  if (id) void queryClient.prefetchQuery(boothQueries.card(id));
};

export default function BoothCardRoute() {
  const id = jobIdOf(useParams().jobId);
  const card = useQuery({ ...boothQueries.card(id ?? 0), enabled: id !== null });
  if (id === null || (isApiError(card.error) && (card.error.status === 404 || card.error.status === 400)))
    return <InPageNotFound what="Job" backTo={paths.boothIndex} backLabel="Back to the booth" />;
  if (card.error && !card.data) return <Alert tone="error">{card.error.message}</Alert>;
  if (!card.data) return <Spinner label="Loading the booth card…" />;
  return (
    <BoothCard
      card={card.data}
      receivedAt={card.dataUpdatedAt}
      paths={{ job: paths.job(id), prep: paths.jobPrep(id), ticket: paths.jobTicket(id), jobPlan: paths.jobPlan(id), mixSheet: paths.mixSheet }}
    />
  );
}
