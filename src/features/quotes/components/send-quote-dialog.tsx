import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { formatCents } from "@shared/quote/index";
import { sendQuoteInputSchema, type QuoteDetailDto } from "@shared/schemas/quote.schema";
import { applyServerErrors } from "@/lib/form-errors";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { FormActions } from "@/components/ui/form/form-actions";
import { TextField } from "@/components/ui/form/text-field";
import { TextareaField } from "@/components/ui/form/textarea-field";
import { toast } from "@/components/ui/toast/toast-store";
import { useSendQuote } from "../api/quotes.queries";

type In = z.input<typeof sendQuoteInputSchema>;
type Out = z.output<typeof sendQuoteInputSchema>;

/** E-mails the quote (PDF attached, portal link inside). If the mail server fails, the quote stays as it was. */
export function SendQuoteDialog({ quote, onClose }: { quote: QuoteDetailDto; onClose: () => void }) {
  const send = useSendQuote(quote.id);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<In, unknown, Out>({
    resolver: zodResolver(sendQuoteInputSchema),
    defaultValues: { to: quote.customerEmail ?? "", message: "" },
  });
  const again = quote.current.sentAt !== null;
  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await send.mutateAsync(values);
      toast.success(`Quote #${quote.id} sent to ${values.to ?? quote.customerEmail}`);
      onClose();
    } catch (error) {
      setProblem(applyServerErrors(error, setError, ["to", "message"]));
    }
  });
  return (
    <Dialog
      title={again ? `Send version ${quote.version} again` : `Send quote #${quote.id}`}
      description={`${formatCents(quote.current.totals.totalCents)} for ${quote.jobTitle}; deposit ${formatCents(quote.current.totals.depositCents)}. The PDF is attached and the e-mail has a link to approve and pay online.`}
      onClose={onClose}
    >
      <form onSubmit={submit} noValidate className="flex flex-col gap-5">
        {problem ? (
          <Alert tone="error" title="Not sent">
            {problem} {again ? "" : "The quote is still a draft."}
          </Alert>
        ) : null}
        <TextField label="Send to" type="email" required error={errors.to?.message} {...register("to", { setValueAs: (v) => (v === "" ? undefined : v) })} />
        <TextareaField label="Message (optional)" rows={4} hint="Replaces the opening line of the e-mail." error={errors.message?.message} {...register("message")} />
        <FormActions>
          <Button type="submit" size="lg" pending={isSubmitting}>
            {again ? "Send again" : "Send quote"}
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </FormActions>
      </form>
    </Dialog>
  );
}
