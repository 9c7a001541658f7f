import { PlaceholderPage } from "@/components/ui/placeholder-page.tsx";

export function Component() {
  return (
    <PlaceholderPage
      title="Sites"
      purpose="Your shop's sites and the machines at each; picking a machine fills the directory's filters."
    />
  );
}
