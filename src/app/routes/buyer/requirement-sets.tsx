import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Requirement sets"
      purpose="What a technician must hold to work at your sites: insurance limits, safety training and OEM training."
    />
  );
}
