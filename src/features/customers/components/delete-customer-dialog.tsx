import type { CustomerDto } from "@shared/schemas/customer.schema";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { useDeleteCustomer } from "../api/customers.queries";

/** The server keeps customers with jobs or a portal account (409); its reason is shown here. */
export function DeleteCustomerDialog({ customer, onClose, onDeleted }: { customer: CustomerDto; onClose: () => void; onDeleted: () => void }) {
  const remove = useDeleteCustomer();
  return (
    <ConfirmDialog
      title={`Delete ${customer.name}?`}
      confirmLabel="Delete customer"
      pending={remove.isPending}
      failure="The customer could not be deleted."
      onConfirm={async () => {
        await remove.mutateAsync(customer.id);
        return `Deleted ${customer.name}`;
      }}
      onDone={onDeleted}
      onClose={onClose}
    >
      {customer.jobCount > 0
        ? `${customer.name} has ${customer.jobCount} job${customer.jobCount === 1 ? "" : "s"}; the shop keeps customers with history.`
        : "The customer record and its notes are removed for good."}
    </ConfirmDialog>
  );
}
