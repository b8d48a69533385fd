import { useState } from "react";
import { useNavigate } from "react-router";
import { useQuery } from "@tanstack/react-query";
import { Pencil, Plus, Trash2 } from "lucide-react";
import type { CustomerDto } from "@shared/schemas/customer.schema";
import { isApiError } from "@/lib/api-client";
import { Button, ButtonLink } from "@/components/ui/button";
import { Dialog } from "@/components/ui/dialog";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { Spinner } from "@/components/ui/spinner";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { AccessGate } from "@/features/auth/components/access-gate";
import { customerQueries, useUpdateCustomer } from "@/features/customers/api/customers.queries";
import { CustomerContact } from "@/features/customers/components/customer-contact";
import { CustomerForm } from "@/features/customers/components/customer-form";
import { DeleteCustomerDialog } from "@/features/customers/components/delete-customer-dialog";
import { CustomerJobList } from "@/features/jobs/components/job-list-compact";
import { InPageNotFound } from "../in-page-not-found";
import { useIdParam } from "@/hooks/use-id-param";

export default function CustomerRoute() {
  return (
    <AccessGate access="office">
      <CustomerLoader />
    </AccessGate>
  );
}

function CustomerLoader() {
  const { id, valid } = useIdParam("customerId");
  const { data, error, isPending } = useQuery({ ...customerQueries.detail(id), enabled: valid });
  if (!valid || (isApiError(error) && (error.status === 404 || error.status === 400)))
    return <InPageNotFound what="Customer" backTo={paths.customers} backLabel="Back to customers" />;
  if (isPending || !data) return <Spinner label="Loading the customer…" />;
  return <CustomerPage customer={data} />;
}

function CustomerPage({ customer }: { customer: CustomerDto }) {
  const navigate = useNavigate();
  const [dialog, setDialog] = useState<"edit" | "delete" | null>(null);
  return (
    <>
      <PageHeader
        eyebrow="Customer"
        title={customer.name}
        actions={
          <>
            <ButtonLink to={`${paths.newJob}?customer=${customer.id}`} icon={<Plus aria-hidden className="size-5" />}>
              New job
            </ButtonLink>
            <Button variant="secondary" onClick={() => setDialog("edit")} icon={<Pencil aria-hidden className="size-4" />}>
              Edit
            </Button>
            <Button variant="danger" onClick={() => setDialog("delete")} icon={<Trash2 aria-hidden className="size-4" />}>
              Delete
            </Button>
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-[22rem_minmax(0,1fr)]">
        <Panel title="Contact" titleId="contact-heading">
          <CustomerContact customer={customer} />
        </Panel>
        <Panel title={`Jobs (${customer.jobCount})`} titleId="customer-jobs-heading">
          <CustomerJobList customerId={customer.id} />
        </Panel>
      </div>
      {dialog === "edit" ? <EditCustomerDialog customer={customer} onClose={() => setDialog(null)} /> : null}
      {dialog === "delete" ? (
        <DeleteCustomerDialog customer={customer} onClose={() => setDialog(null)} onDeleted={() => navigate(paths.customers, { replace: true })} />
      ) : null}
    </>
  );
}

function EditCustomerDialog({ customer, onClose }: { customer: CustomerDto; onClose: () => void }) {
  const update = useUpdateCustomer(customer.id);
  return (
    <Dialog title={`Edit ${customer.name}`} onClose={onClose} size="lg">
      <CustomerForm
        submitLabel="Save customer"
        defaultValues={{
          name: customer.name,
          email: customer.email ?? "",
          phone: customer.phone ?? "",
          address: customer.address ?? "",
          notes: customer.notes ?? "",
        }}
        onCancel={onClose}
        onSubmit={async (values) => {
          await update.mutateAsync({ ...values, version: customer.version });
          toast.success("Customer saved");
          onClose();
        }}
      />
    </Dialog>
  );
}
