import { Plus } from "lucide-react";
import { roleCan } from "@shared/domain/roles";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { paths } from "@/config/paths";
import { useCurrentUser } from "@/features/auth/hooks/use-current-user";
import { LowStockPanel, MaterialsCatalogue } from "@/features/materials/components/materials-catalogue";

export default function MaterialsRoute() {
  const user = useCurrentUser();
  const office = roleCan(user.role, "office");
  return (
    <>
      <PageHeader
        title="Materials"
        description="The shop's catalogue: what each product is, what is on the shelf, and its data sheets."
        actions={
          office ? (
            <ButtonLink to={paths.newMaterial} icon={<Plus aria-hidden className="size-5" />}>
              New material
            </ButtonLink>
          ) : null
        }
      />
      <LowStockPanel />
      <MaterialsCatalogue showCost={office} />
    </>
  );
}
