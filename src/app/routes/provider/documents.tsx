import { CautionNote } from "@/components/ui/caution-note.tsx";
import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Documents"
      purpose="Your company's certificates of insurance and other documents, with each one's verification status. Answer returned documents here."
    >
      <CautionNote />
    </PlaceholderPage>
  );
}
