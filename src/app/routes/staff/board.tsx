import { useSearchParams } from "react-router";
import { Archive, Plus } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import { Button, ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { paths } from "@/config/paths";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { JobBoard } from "@/features/jobs/components/job-board";

export default function BoardRoute() {
  const user = useCurrentUser();
  const [searchParams, setSearchParams] = useSearchParams();
  const showClosed = searchParams.get("closed") === "1";
  const painter = user.role === "painter";
  return (
    <>
      <PageHeader
        title={painter ? "My jobs board" : "Board"}
        description={painter ? "The jobs assigned to you, by stage." : "Every job by stage, most urgent first."}
        actions={
          <>
            <Button
              variant="secondary"
              aria-pressed={showClosed}
              onClick={() =>
                setSearchParams((prev) => {
                  const next = new URLSearchParams(prev);
                  if (showClosed) next.delete("closed");
                  else next.set("closed", "1");
                  return next;
                })
              }
              icon={<Archive aria-hidden className="size-4" />}
            >
              Show delivered and cancelled
            </Button>
            {roleCan(user.role, "office") ? (
              <ButtonLink to={paths.newJob} icon={<Plus aria-hidden className="size-5" />}>
                New job
              </ButtonLink>
            ) : null}
          </>
        }
      />
      <JobBoard role={user.role} showClosed={showClosed} />
    </>
  );
}
