import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Technicians"
      purpose="Your technicians, each with their standing, training cards and what lapses next."
    />
  );
}
