import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Upload a card"
      purpose="Drop a photo or PDF of a training card, check the fields read from it, and send it for verification."
    />
  );
}
