import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Verification queue"
      purpose="Documents waiting for verification, oldest first, with how long each has waited. Open one to compare it with its fields, then verify it or return it with a reason."
    />
  );
}
