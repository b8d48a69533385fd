import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { portalFinishRecordPdfUrl, portalQueries } from "@/features/portal/api/portal.queries";
import { FinishRecordView } from "@/features/finish-record/components/finish-record-view";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

/** The customer's copy of the finish record of their job (no internal notes, no costs). */
export default function PortalFinishRecordRoute() {
  const { id, valid } = useIdParam("jobId");
  const record = useQuery({ ...portalQueries.finishRecord(id), enabled: valid });
  if (!valid || (isApiError(record.error) && (record.error.status === 404 || record.error.status === 400)))
    return <InPageNotFound what="Job" backTo={paths.portal} backLabel="Back to my jobs" />;
  if (record.error) return <Alert tone="error">{record.error.message}</Alert>;
  if (!record.data) return <Spinner label="Loading the finish record…" />;
  return <FinishRecordView record={record.data} pdfUrl={portalFinishRecordPdfUrl(id)} />;
}
