import { useState } from "react";
import type { SuggestionDto } from "@shared/schemas/schedule.schema";
import { PageHeader } from "@/components/ui/page-header";
import { AccessGate } from "@/features/auth/components/access-gate";
import { JobsToBook } from "@/features/schedule/components/jobs-to-book";
import { ScheduleView } from "@/features/schedule/components/schedule-view";
import { SuggestionPanel } from "@/features/schedule/components/suggestion-panel";

export default function ScheduleRoute() {
  const [suggestion, setSuggestion] = useState<SuggestionDto | null>(null);
  return (
    <AccessGate access="office">
      <PageHeader
        title="Booth schedule"
        description="Each job's layers as booth sessions: set-up, coats and flashes (solid), then the cure kept in the booth (striped). Layers wait for the one under them to dry and go on before its recoat window closes."
      />
      <div className="flex flex-col gap-6">
        <ScheduleView movable preview={suggestion} />
        <SuggestionPanel suggestion={suggestion} onChange={setSuggestion} />
        <JobsToBook />
      </div>
    </AccessGate>
  );
}
