import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Work orders"
      purpose="Work you have requested from technicians: follow it, confirm completion and rate the job."
    />
  );
}
