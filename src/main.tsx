import "../workers/zod-jitless";
import { StrictMode } from "react";
import { createRoot } from "react-dom/client";
import { App } from "@/app/app";
import "./index.css";

const root = document.getElementById("root");
if (!root) throw new Error("index.html lacks #root");
createRoot(root).render(
  <StrictMode>
    <App />
  </StrictMode>,
);
