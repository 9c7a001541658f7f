import { useNavigate } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { useAddTechnician } from "@/features/technicians/api/add-technician.ts";
import { TechnicianForm } from "@/features/technicians/components/technician-form.tsx";

export function Component() {
  const add = useAddTechnician();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader
        title="Add technician"
        description="Rates are what you bill a shop; travel is billed portal to portal at its own rate."
      />
      <TechnicianForm
        submitLabel="Add technician"
        pending={add.isPending}
        serverError={add.error}
        onSubmit={(input) =>
          add.mutate(input, { onSuccess: (technician) => navigate(hrefs.technician(technician.id)) })
        }
      />
    </>
  );
}
