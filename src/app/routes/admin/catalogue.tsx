import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Catalogue"
      purpose="The credential types technicians and companies can hold: category, holder, validity rule and the fields each carries."
    />
  );
}
