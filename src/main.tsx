import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
// Work Sans ships inside the bundle so no request leaves the machine for fonts.
import "@fontsource/work-sans/400.css";
import "@fontsource/work-sans/500.css";
import "@fontsource/work-sans/600.css";
import "./index.css";
import { AppProvider } from "./app/provider.tsx";
import { AppRouter } from "./app/router.tsx";

const root = document.getElementById("root");
if (!root) throw new Error("index.html has no #root element");

createRoot(root).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);
