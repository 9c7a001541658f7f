import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Work orders"
      purpose="Requests from machine shops: accept or decline, record completion, and keep the message thread."
    />
  );
}
