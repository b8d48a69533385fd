import { useState } from "react";
import type { CustomerDto } from "@shared/schemas/customer.schema";
import { isApiError } from "@/lib/api-client";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { toast } from "@/components/ui/toast/toast-store";
import { useDeleteCustomer } from "../api/customers.queries";

/** The server keeps customers with jobs or a portal account (409); its reason is shown here. */
export function DeleteCustomerDialog({ customer, onClose, onDeleted }: { customer: CustomerDto; onClose: () => void; onDeleted: () => void }) {
  const remove = useDeleteCustomer();
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <Dialog title={`Delete ${customer.name}?`} onClose={onClose}>
      <div className="flex flex-col gap-4">
        {problem ? <Alert tone="error" title="Not deleted">{problem}</Alert> : null}
        <p>
          {customer.jobCount > 0
            ? `${customer.name} has ${customer.jobCount} job${customer.jobCount === 1 ? "" : "s"}; the shop keeps customers with history.`
            : "The customer record and its notes are removed for good."}
        </p>
        <div className="flex flex-wrap gap-3">
          <Button
            variant="danger"
            size="lg"
            pending={remove.isPending}
            onClick={async () => {
              setProblem(null);
              try {
                await remove.mutateAsync(customer.id);
                toast.success(`Deleted ${customer.name}`);
                onDeleted();
              } catch (error) {
                setProblem(isApiError(error) ? error.message : "The customer could not be deleted.");
              }
            }}
          >
            Delete customer
          </Button>
          <Button variant="ghost" size="lg" onClick={onClose}>
            Keep
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
