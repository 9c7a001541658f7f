import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";
import { StatusKey } from "@/components/ui/status-key.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="My standing"
      purpose="Your standing and your training cards: whether you are cleared today, and when each card lapses."
    >
      <StatusKey />
    </PlaceholderPage>
  );
}
