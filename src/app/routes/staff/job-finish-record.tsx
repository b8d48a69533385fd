import { useQuery } from "@tanstack/react-query";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Spinner } from "@/components/ui/spinner";
import { paths } from "@/config/paths";
import { finishRecordPdfUrl, finishRecordQueries } from "@/features/finish-record/api/finish-record.queries";
import { FinishRecordView } from "@/features/finish-record/components/finish-record-view";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

/** The job's finish record: what was really sprayed, printable, for the shop's files. */
export default function JobFinishRecordRoute() {
  const { id, valid } = useIdParam("jobId");
  const record = useQuery({ ...finishRecordQueries.detail(id), enabled: valid });
  if (!valid || (isApiError(record.error) && (record.error.status === 404 || record.error.status === 400)))
    return <InPageNotFound what="Job" backTo={paths.jobs} backLabel="Back to jobs" />;
  if (record.error) return <Alert tone="error">{record.error.message}</Alert>;
  if (!record.data) return <Spinner label="Loading the finish record…" />;
  return (
    <>
      <title>{`Finish record · job #${id} · Coatwright`}</title>
      <FinishRecordView record={record.data} pdfUrl={finishRecordPdfUrl(id)} />
    </>
  );
}
