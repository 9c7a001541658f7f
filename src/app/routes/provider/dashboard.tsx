import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Dashboard"
      purpose="What lapses next and what was returned: every credential of your company and your technicians that needs you, soonest first."
    >
      <StatusKey />
    </PlaceholderPage>
  );
}
