import { CautionNote } from "@/components/ui/caution-note.tsx";
import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Directory"
      purpose="Cleared technicians near your sites: filter by credential, OEM training, technology, insurance limits, distance and rating. Only technicians cleared today appear."
    >
      <CautionNote />
    </PlaceholderPage>
  );
}
