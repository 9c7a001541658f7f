import { useSuspenseQuery } from "@tanstack/react-query";
import { useNavigate, useParams, type LoaderFunctionArgs } from "react-router-dom";
import { hrefs } from "@/config/paths.ts";
import { PageHeader } from "@/components/ui/page-header.tsx";
import { useEditTechnician } from "@/features/technicians/api/edit-technician.ts";
import { technicianQuery } from "@/features/technicians/api/get-technician.ts";
import { TechnicianForm } from "@/features/technicians/components/technician-form.tsx";
import { queryClient } from "@/lib/query-client.ts";
import { technicianIdOf } from "./technician-id.ts";

export async function loader({ params }: LoaderFunctionArgs) {
  await queryClient.ensureQueryData(technicianQuery(technicianIdOf(params)));
  return null;
}

export function Component() {
  const id = technicianIdOf(useParams());
  const { data: technician } = useSuspenseQuery(technicianQuery(id));
  const edit = useEditTechnician();
  const navigate = useNavigate();
  return (
    <>
      <PageHeader title={`Edit ${technician.name}`} />
      <TechnicianForm
        technician={technician}
        submitLabel="Save changes"
        pending={edit.isPending}
        serverError={edit.error}
        onSubmit={(input) => edit.mutate({ id, input }, { onSuccess: () => navigate(hrefs.technician(id)) })}
      />
    </>
  );
}
