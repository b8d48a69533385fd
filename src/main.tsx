import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import "@fontsource-variable/inter/wght.css";
import "./index.css";
import { AppProvider, createQueryClient } from "@/app/provider";
import { createAppRouter } from "@/app/router";
import { registerServiceWorker } from "@/lib/service-worker";

const root = document.getElementById("root");
if (!root) throw new Error("The page has no #root element");

// The router starts loading the page's code and the signed-in user the moment it exists, so it is made before
// React's first render rather than inside it.
const queryClient = createQueryClient();
const router = createAppRouter(queryClient);

createRoot(root).render(
  <StrictMode>
    <AppProvider queryClient={queryClient} router={router} />
  </StrictMode>,
);
registerServiceWorker();
