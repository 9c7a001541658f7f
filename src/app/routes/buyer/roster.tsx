import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Roster"
      purpose="Your approved vendors and their technicians, with each one's standing against your requirement sets."
    />
  );
}
