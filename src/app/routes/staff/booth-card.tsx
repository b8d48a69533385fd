import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { boothQueries } from "@/features/booth/api/booth.queries";
import { BoothCard } from "@/features/booth/components/booth-card";
import { useCardWithQueue } from "@/features/booth/hooks/use-card-with-queue";
import type { RouteModule } from "@/app/router";
import { InPageNotFound } from "../in-page-not-found";
import { idFrom, useIdParam } from "@/hooks/use-id-param";

/** The card starts loading with the screen's code. */
export const prefetch: RouteModule["prefetch"] = (queryClient, { params }) => {
  const { id, valid } = idFrom(params.jobId);
  if (valid) void queryClient.prefetchQuery(boothQueries.card(id));
};

export default function BoothCardRoute() {
  const { id, valid } = useIdParam("jobId");
  const card = useQuery({ ...boothQueries.card(id), enabled: valid });
  const { shown, queued } = useCardWithQueue(card.data, card.dataUpdatedAt);
  if (!valid || (isApiError(card.error) && (card.error.status === 404 || card.error.status === 400)))
    return <InPageNotFound what="Job" backTo={paths.boothIndex} backLabel="Back to the booth" />;
  if (card.error && !card.data) return <Alert tone="error">{card.error.message}</Alert>;
  if (!card.data || !shown) return <Spinner label="Loading the booth card…" />;
  return (
    <BoothCard
      card={shown}
      queued={queued}
      receivedAt={card.dataUpdatedAt}
      paths={{ job: paths.job(id), prep: paths.jobPrep(id), ticket: paths.jobTicket(id), jobPlan: paths.jobPlan(id), mixSheet: paths.mixSheet }}
    />
  );
}
