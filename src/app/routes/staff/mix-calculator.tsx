import { PageHeader } from "@/components/ui/page-header";
import { MixCalculator } from "@/features/mix/components/mix-calculator";

export default function MixCalculatorRoute() {
  return (
    <>
      <PageHeader title="Mix calculator" description="Parts or percent, a wanted total or what is on hand: the amounts update as you type." />
      <MixCalculator />
    </>
  );
}
