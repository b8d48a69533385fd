import { useNavigate } from "react-router";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { toast } from "@/components/ui/toast/toast-store";
import { paths } from "@/config/paths";
import { AccessGate } from "@/features/auth/components/access-gate";
import { useCreateMaterial } from "@/features/materials/api/materials.queries";
import { MaterialForm } from "@/features/materials/components/material-form";

export default function NewMaterialRoute() {
  return (
    <AccessGate access="office">
      <NewMaterialPage />
    </AccessGate>
  );
}

function NewMaterialPage() {
  const navigate = useNavigate();
  const create = useCreateMaterial();
  return (
    <>
      <PageHeader title="New material" description="Copy the figures from the maker's technical data sheet." />
      <Panel className="max-w-3xl">
        <MaterialForm
          submitLabel="Add to catalogue"
          onCancel={() => navigate(paths.materials)}
          onSubmit={async (values) => {
            const m = await create.mutateAsync(values);
            toast.success(`Added ${m.code} ${m.name}`);
            navigate(paths.material(m.id));
          }}
        />
      </Panel>
    </>
  );
}
